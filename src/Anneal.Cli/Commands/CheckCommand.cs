using System.CommandLine;
using System.Text.Json.Nodes;
using Anneal.Cli.Reporting;
using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Formats.Input;

namespace Anneal.Cli.Commands;

/// <summary>`anneal check`: reads an input and reports every problem in it, or what it holds when it is valid.</summary>
public static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var input = SharedOptions.Input();
        var json = JsonOutput.Option();
        var command = new Command("check", "Read an input and list every problem in it; exit 0 when it is valid, 3 when valid but it cannot be fully served, 2 when not valid.");
        command.Arguments.Add(input);
        command.Options.Add(json);
        command.SetAction(parse => Execute(parse.GetValue(input)!, JsonOutput.For(context, parse.GetValue(json))));
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
            if (context.Json is not null)
            {
                JsonOutput.Write(context.Json, JsonOutput.Envelope(new JsonObject { ["input"] = path, ["valid"] = false }, ExitCodes.InvalidInput, "the input is not valid", e.Problems));
            }

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

        var warnings = loaded.Warnings.Concat(RuleScreen.Warnings(instance)).ToList();
        foreach (var warning in warnings)
        {
            context.Out.WriteLine("  warning: " + warning);
        }

        if (obstacles.Count == 0)
        {
            context.Out.WriteLine("  screening: found nothing that rules out serving every stop (capacity, equipment, windows, shifts, durations)");
        }

        int code = obstacles.Count == 0 ? ExitCodes.Success : ExitCodes.Infeasible;
        if (context.Json is not null)
        {
            JsonOutput.Write(context.Json, JsonOutput.Envelope(Read(path, loaded, obstacles, warnings), code, null, null));
        }

        return code;
    }

    /// <summary>What check found in a valid input, for --json.</summary>
    private static JsonObject Read(string path, LoadedInput loaded, IReadOnlyList<Obstacle> obstacles, List<string> warnings)
    {
        var instance = loaded.Instance;
        var screening = new JsonArray();
        foreach (var o in obstacles)
        {
            screening.Add(new JsonObject { ["rule"] = o.Rule, ["stop"] = o.Stop, ["message"] = o.Message });
        }

        var said = new JsonArray();
        foreach (var w in warnings)
        {
            said.Add(w);
        }

        return new JsonObject
        {
            ["input"] = path,
            ["valid"] = true,
            ["format"] = loaded.Format,
            ["readAs"] = loaded.ReadAs,
            ["instance"] = instance.Name,
            ["objectiveKind"] = instance.Objective.ToText(),
            ["stops"] = instance.StopCount,
            ["depots"] = instance.Depots.Count,
            ["vehicles"] = instance.Vehicles.Count,
            ["screening"] = screening,
            ["warnings"] = said,
        };
    }
}
