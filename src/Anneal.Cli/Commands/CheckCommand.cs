using System.CommandLine;
using Anneal.Cli.Reporting;
using Anneal.Core.Screening;
using Anneal.Formats.Input;

namespace Anneal.Cli.Commands;

/// <summary>`anneal check`: reads an input and reports every problem in it, or what it holds when it is valid.</summary>
public static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var input = SharedOptions.Input();
        var command = new Command("check", "Read an input and list every problem in it; exit 0 when it is valid, 3 when valid but it cannot be fully served, 2 when not valid.");
        command.Arguments.Add(input);
        command.SetAction(parse => Execute(parse.GetValue(input)!, context));
        return command;
    }

    public static int Execute(string path, CliContext context)
    {
        LoadedInput loaded;
        try
        {
            loaded = InputLoader.Load(path);
        }
        catch (InputException e)
        {
            ProblemPrinter.Print(context.Out, e.Problems);
            return ExitCodes.InvalidInput;
        }

        var instance = loaded.Instance;
        var obstacles = JobScreen.Screen(instance);
        string dialect = loaded.Format + (loaded.ReadAs is null ? string.Empty : ", " + loaded.ReadAs);
        context.Out.WriteLine(obstacles.Count == 0
            ? $"{path}: valid ({dialect})"
            : $"{path}: valid ({dialect}), but cannot be fully served: {InstanceDescription.Plural(obstacles.Count, "reason")}");
        foreach (var o in obstacles)
        {
            context.Out.WriteLine("  - " + o.Message);
        }

        context.Out.WriteLine("  " + InstanceDescription.Size(instance));
        context.Out.WriteLine("  " + InstanceDescription.Rules(instance));
        foreach (var line in RuleMeanings.Lines(instance))
        {
            context.Out.WriteLine("    " + line);
        }

        foreach (var warning in loaded.Warnings.Concat(RuleScreen.Warnings(instance)))
        {
            context.Out.WriteLine("  warning: " + warning);
        }

        if (obstacles.Count == 0)
        {
            context.Out.WriteLine("  screening: found nothing that rules out serving every stop (capacity, equipment, windows, shifts, durations)");
            return ExitCodes.Success;
        }

        return ExitCodes.Infeasible;
    }
}
