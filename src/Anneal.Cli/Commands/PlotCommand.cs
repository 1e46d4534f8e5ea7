using System.CommandLine;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Reports;
using Anneal.Formats.Output.Runs;

namespace Anneal.Cli.Commands;

/// <summary>
/// `anneal plot`: redraws a finished run's pictures and report.html from its folder without solving again. The
/// instance is read again from the input path kept in run.json and the plan re-judged by the evaluator.
/// </summary>
public static class PlotCommand
{
    public static Command Create(CliContext context)
    {
        var folder = new Argument<string>("run-folder") { Description = "A folder written by `anneal solve` or `anneal evaluate --out`." };
        var input = new Option<string?>("--input")
        {
            Description = "Where the job is now, when it has moved since the run (default: the path kept in run.json).",
            HelpName = "path",
        };
        var command = new Command("plot", "Redraw the pictures (convergence, routes, schedule) and report.html of a finished run without solving again.");
        command.Arguments.Add(folder);
        command.Options.Add(input);
        command.SetAction(parse => Execute(parse.GetValue(folder)!, parse.GetValue(input), context));
        return command;
    }

    public static int Execute(string folder, string? inputPath, CliContext context)
    {
        string recordPath = Path.Combine(folder, RunRecordFile.FileName);
        if (!File.Exists(recordPath))
        {
            context.Err.WriteLine($"anneal: {recordPath} not found; give a folder written by `anneal solve` (runs from before run.json existed cannot be redrawn)");
            return ExitCodes.InvalidInput;
        }

        RunRecord record;
        try
        {
            record = RunRecordFile.Read(recordPath);
        }
        catch (InvalidDataException e)
        {
            context.Err.WriteLine("anneal: " + e.Message);
            return ExitCodes.InvalidInput;
        }

        string path = inputPath ?? record.InputPath;
        if (!Directory.Exists(path) && !File.Exists(path))
        {
            RunReport.WriteConvergence(folder);
            context.Err.WriteLine($"anneal: the input {path} is no longer there, so only the convergence plot was redrawn; "
                + "give the job's new place with --input PATH to redraw the map, the schedule and report.html");
            return ExitCodes.InvalidInput;
        }

        var loaded = InputLoader.Load(path);
        var instance = loaded.Instance;
        if (ObjectiveNames.TryParse(record.Objective, out var objective) && objective != instance.Objective)
        {
            instance = instance.With(objective: objective);
        }

        var plan = PlanFromRecord.Build(instance, record.Routes, out var missing);
        if (plan is null)
        {
            string which = missing.Count > 0 ? ": it no longer has " + string.Join(", ", missing.Take(5)) + (missing.Count > 5 ? ", …" : string.Empty) : string.Empty;
            context.Err.WriteLine($"anneal: the plan in {recordPath} does not fit the input {path} as it is now{which}");
            return ExitCodes.InvalidInput;
        }

        var evaluation = PlanEvaluator.Evaluate(instance, plan);
        RunReport.Write(folder, instance, evaluation);
        context.Out.WriteLine($"Redrawn in {Path.GetFullPath(folder)}: {string.Join(", ", RunReport.Files.Where(f => File.Exists(Path.Combine(folder, f))))}");
        return ExitCodes.Success;
    }
}
