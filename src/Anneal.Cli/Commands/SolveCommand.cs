using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Formats.Input;
using Anneal.Jobs;
using Microsoft.Extensions.DependencyInjection;
using Anneal.Core.Solving;

namespace Anneal.Cli.Commands;

/// <summary>`anneal solve`: runs the chosen solvers side by side and writes the best plan they found.</summary>
public static class SolveCommand
{
    /// <summary>Search time when neither the command line nor the job says (seconds).</summary>
    public const double DefaultTimeSeconds = 30;

    public static Command Create(CliContext context)
    {
        var input = SharedOptions.Input();
        var solvers = new Option<string?>("--solvers") { Description = "Comma-separated solver names, e.g. sa,tabu. Default: the job's list, else all that apply.", HelpName = "list" };
        var time = OptionValues.Seconds("--time", $"Wall-clock budget in seconds. Default: the job's timeSeconds, else {DefaultTimeSeconds}.");
        var iterations = OptionValues.Count("--iterations", "Also stop each solver after this many iterations (reproducible with --seed).", 1);
        var target = OptionValues.Number("--target", "Stop a solver as soon as it has a feasible plan with an objective at or below this.", "objective");
        var objective = SharedOptions.Objective();
        var seed = OptionValues.Seed("--seed", "Random seed (solver k uses seed + k). Default: the job's seed, else 1.");
        var threads = OptionValues.Whole("--threads", "Independent searches per solver run in parallel. Default 1.", 1);
        var output = SharedOptions.Out("Output folder. Default: runs/<instance>-<yyyyMMdd-HHmmss> under the current folder.");
        var quiet = new Option<bool>("--quiet") { Description = "No progress lines while solving." };
        var from = new Option<string?>("--from") { Description = "Start from this plan (a routes.csv of an earlier run, possibly edited): a warm start never worse than it, or with --now a re-plan of the rest of the day; writes changes.csv.", HelpName = "plan.csv" };
        var now = OptionValues.Clock("--now", "With --from: the clock time of the job's day that fixes the past (stops started by then, or marked done, keep vehicle, order and times).");
        var without = new Option<string?>("--without") { Description = "With --from: vehicle ids taken out (comma-separated); their unstarted stops go back into the pool.", HelpName = "list" };
        var json = JsonOutput.Option();
        var command = new Command("solve", "Search for a good plan and write routes.csv, summary.json and trace.csv; exit 0 feasible, 3 infeasible, 130 interrupted.");
        command.Arguments.Add(input);
        foreach (Option option in new Option[] { solvers, time, iterations, target, objective, seed, threads, output, quiet, from, now, without, json })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var request = new SolveRequest
            {
                Solvers = parse.GetValue(solvers),
                TimeSeconds = parse.GetValue(time),
                Iterations = parse.GetValue(iterations),
                Target = parse.GetValue(target),
                Objective = parse.GetValue(objective),
                Seed = parse.GetValue(seed),
                Threads = parse.GetValue(threads),
                OutDir = parse.GetValue(output),
                Quiet = parse.GetValue(quiet),
                From = parse.GetValue(from),
                Now = parse.GetValue(now),
                Without = parse.GetValue(without),
            };
            if (request.From is null && (request.Now is not null || request.Without is not null))
            {
                const string NeedsFrom = "--now and --without re-plan a given plan: add --from PLAN.csv (the routes.csv of the run to re-plan)";
                context.Err.WriteLine("anneal: " + NeedsFrom);
                if (parse.GetValue(json))
                {
                    JsonOutput.Write(context.Out, JsonOutput.Error(ExitCodes.InvalidInput, NeedsFrom));
                }

                return ExitCodes.InvalidInput;
            }

            return Execute(InputLoader.Load(parse.GetValue(input)!), request, JsonOutput.For(context, parse.GetValue(json)));
        });
        return command;
    }

    public static int Execute(LoadedInput input, SolveRequest request, CliContext context)
    {
        var runner = context.Services.GetRequiredService<JobRunner>();
        JobPlan plan;
        try
        {
            plan = runner.Prepare(input, request.ToJob(DefaultTimeSeconds, context.SinceStart()));
        }
        catch (UnknownSolverException e)
        {
            context.Err.WriteLine("anneal: " + e.Message);
            if (context.Json is not null)
            {
                JsonOutput.Write(context.Json, JsonOutput.Error(ExitCodes.InvalidInput, e.Message));
            }

            return ExitCodes.InvalidInput;
        }

        // Create the folder first: better to fail now than after the whole time budget.
        var instance = plan.Instance;
        string folder = OutputFolder.Create(request.OutDir ?? OutputFolder.Default(context.WorkingDirectory, instance.Name, context.Now()));
        if (!request.Quiet)
        {
            context.Err.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"Solving {InstanceDescription.Size(instance)} with {string.Join(", ", plan.SolverNames)} for up to {plan.Seconds:0.##} s (seed {plan.Seed}); Ctrl+C stops early and keeps the best plan."));
        }

        // Said even with --quiet: they change what the run does or what it can be compared with.
        foreach (var note in plan.Notes)
        {
            context.Err.WriteLine("note: " + note);
        }

        if (Oversubscription.Warning(plan.Solvers.Count, plan.Options.Threads, 1, Environment.ProcessorCount) is { } crowded)
        {
            context.Err.WriteLine("warning: " + crowded);
        }

        if (Anneal.Core.Screening.RuleScreen.ObjectiveWarning(instance) is { } blind)
        {
            context.Err.WriteLine("warning: " + blind);
        }

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.Cancel);
        using var signals = context.HandleSignals ? new ShutdownSignals(stop) : null;
        var progress = request.Quiet ? null : new ProgressReporter(context.Err, context.ProgressIsTerminal, plan.Options.TimeLimit);
        var run = runner.Run(plan, progress is null ? null : progress.Report, stop.Token);
        progress?.Finish();

        var best = run.Outcome.Best;
        var summary = context.Services.GetRequiredService<RunWriter>().Write(folder, run, context.Now().ToUniversalTime());

        var w = context.Out;
        if (run.Interrupted)
        {
            w.WriteLine($"Interrupted: the best plan found so far is written, without the pictures and report.html so that the stop is prompt (anneal plot {folder} draws them).");
        }

        PrintSolvers(w, run.Outcome);
        w.WriteLine(best.Result.HasPlan ? $"Chosen: {best.Result.Solver}" : "Chosen: none (no solver found a plan; the plan written serves no stop)");
        if (Proof(run.Outcome) is { } proof)
        {
            w.WriteLine(proof);
        }

        PlanReport.Print(w, instance, best.Evaluation, run.Plan.Seconds);
        if (run.Plan.Replan is { } day)
        {
            var changes = Anneal.Core.Replanning.DayChanges.Compute(day, best.Evaluation);
            w.WriteLine((day.Request.Now is double at ? $"Re-planned from {day.Request.Plan.File} at {day.Day.Units.Format(at)}: " : $"Started from {day.Request.Plan.File}: ")
                + changes.Summary(day.Day.Units.TimeWords) + " (changes.csv lists each)");
        }

        w.WriteLine($"Written: {folder}");
        int code = run.Interrupted ? ExitCodes.Interrupted : best.Evaluation.Feasible ? ExitCodes.Success : ExitCodes.Infeasible;
        if (context.Json is not null)
        {
            JsonOutput.Write(context.Json, JsonOutput.Summary(summary, code, folder));
        }

        return code;
    }

    /// <summary>How far the written plan can be from optimal, when a solver proved a bound and the plan keeps the hard rules.</summary>
    private static string? Proof(RunOutcome outcome)
    {
        var best = outcome.Best.Evaluation;
        double? bound = null;
        string? by = null;
        foreach (var judged in outcome.Results)
        {
            if (judged.Result.LowerBound is { } b && double.IsFinite(b) && (bound is null || b > bound))
            {
                (bound, by) = (b, judged.Result.Solver);
            }
        }

        if (!best.Feasible || Anneal.Reports.Traces.TraceFacts.GapPercent(best.Objective, bound) is not { } gap)
        {
            return null;
        }

        return string.Create(CultureInfo.InvariantCulture, $"Lower bound {bound:0.00} ({by}): the plan is proved within {gap:0.0#}% of optimal.");
    }

    /// <summary>Shown instead of a number for a solver that found no plan.</summary>
    private const string NoValue = "—";

    private static void PrintSolvers(TextWriter w, RunOutcome outcome)
    {
        w.WriteLine("Solvers:");
        foreach (var judged in outcome.Results)
        {
            var r = judged.Result;
            var e = judged.Evaluation;
            w.WriteLine(r.BoundOnly
                ? string.Create(CultureInfo.InvariantCulture,
                    $"  {r.Solver,-12} lower bound {(r.LowerBound is { } lb ? lb.ToString("0.00", CultureInfo.InvariantCulture) : "none"),10}  (no plan)  reached at {r.SecondsToBest:0.0} of {r.Seconds:0.0} s  {r.Status.ToText()}")
                : r.HasPlan
                ? string.Create(CultureInfo.InvariantCulture,
                    $"  {r.Solver,-12} objective {e.Objective,12:0.00}  vehicles {e.VehiclesUsed,3}  distance {e.Distance,10:0.00}  {(e.Feasible ? "feasible" : "infeasible"),-10}  best at {r.SecondsToBest:0.0} of {r.Seconds:0.0} s  {r.Status.ToText()}")
                : string.Create(CultureInfo.InvariantCulture,
                    $"  {r.Solver,-12} objective {NoValue,12}  vehicles {NoValue,3}  distance {NoValue,10}  {"no plan",-10}  ran {r.Seconds:0.0} s  {r.Status.ToText()}"));
            foreach (var note in r.Notes ?? [])
            {
                w.WriteLine("      note: " + note);
            }
        }
    }
}
