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
        var command = new Command("check", "Read an input and list every problem in it; exit 0 when it is valid, 2 when not.");
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
        context.Out.WriteLine($"{path}: valid ({loaded.Format}{(loaded.ReadAs is null ? string.Empty : ", " + loaded.ReadAs)})");
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

        var findings = StopScreen.Screen(instance);
        if (findings.Count == 0)
        {
            context.Out.WriteLine("  screening: every stop can be served by at least one vehicle");
        }
        else
        {
            context.Out.WriteLine($"  screening: {findings.Count} stop(s) no vehicle can ever serve (they will be left unserved or break a hard rule):");
            foreach (var f in findings)
            {
                context.Out.WriteLine($"    stop {f.StopId}: {f.Reason}");
            }
        }

        return ExitCodes.Success;
    }
}
