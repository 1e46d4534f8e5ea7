using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Core.Model;
using Anneal.Experiments;
using Anneal.Experiments.Summary;
using Anneal.Formats.Input;
using Anneal.Jobs;
using Anneal.Queue.Bench;
using Anneal.Queue.Jobs;
using Anneal.Search.Diagnostics;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Cli.Commands;

/// <summary>
/// `anneal bench`: an experiment of instances × solvers × seeds × budgets, from the command line or an experiment
/// file (the command line overrides it); resumable into the same folder; statistics, pictures and summaries at the end.
/// </summary>
public static class BenchCommand
{
    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Benchmark files, folders of them, CSV job folders, or globs of these (optional with --experiment).", Arity = ArgumentArity.ZeroOrMore };
        var experiment = new Option<string?>("--experiment") { Description = "JSON experiment file (instances, solvers, seeds, budgets, objective, reference, jobs, out); options given here override it.", HelpName = "file" };
        var solvers = new Option<string>("--solvers") { Description = "Comma-separated solver names.", DefaultValueFactory = _ => "sa,tabu", HelpName = "list" };
        var seeds = OptionValues.Whole("--seeds", "Seeds per solver, instance and budget (1, 2, …).", 1, 3);
        var time = OptionValues.SecondsList("--time", "Wall-clock budget per run in seconds; several, comma-separated, run each.", "10");
        var iterations = OptionValues.Count("--iterations", "Also stop each run after this many iterations.", 1);
        var objective = SharedOptions.Objective();
        var reference = new Option<string?>("--reference") { Description = "CSV of best-known values (the format of ../shared/benchmarks/bks.csv); without one, gaps are to the best found in the experiment.", HelpName = "csv" };
        var jobs = OptionValues.Whole("--jobs", "Runs at once, one solver per core; more than the cores makes timings unfair.", 1, 1);
        var output = SharedOptions.Out("Output folder; running again into the same folder skips runs already in its results.csv. Default: runs/bench-<yyyyMMdd-HHmmss>.");
        var throughput = OptionValues.Seconds("--throughput-seconds", "Seconds spent measuring move evaluations per second on the largest instance (0 skips it).", 2, zero: true);
        var quiet = new Option<bool>("--quiet") { Description = "No line per finished run." };
        var db = Queue.QueueAccess.DbOption();
        db.Description = "Enqueue every run in the PostgreSQL queue at this Npgsql connection string, wait while `anneal worker --db` on any machines runs them, then write the usual outputs.";
        var command = new Command("bench", "Compare solvers: an experiment of instances × solvers × seeds × budgets; results.csv, statistics, pictures and a summary.");
        command.Arguments.Add(inputs);
        foreach (Option option in new Option[] { experiment, solvers, seeds, time, iterations, objective, reference, jobs, output, throughput, quiet, db })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            bool Given(Option option) => parse.GetResult(option) is { Implicit: false };
            var file = parse.GetValue(experiment) is { } path ? ExperimentFile.Read(path) : new ExperimentFile();
            var names = Given(solvers) || file.Solvers is null
                ? parse.GetValue(solvers)!.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
                : file.Solvers.ToArray();
            var known = context.Services.GetRequiredService<JobRunner>().Catalog.Known(names);

            var budgets = Given(time) || file.Budgets is null ? OptionValues.BenchBudgets(parse.GetValue(time)!) : file.Budgets;
            int seedCount = Given(seeds) ? parse.GetValue(seeds) : file.Seeds ?? parse.GetValue(seeds);
            int jobCount = Given(jobs) ? parse.GetValue(jobs) : file.Jobs ?? parse.GetValue(jobs);
            if (seedCount < 1 || jobCount < 1 || budgets is null || budgets.Count == 0 || budgets.Any(b => !(b > 0)))
            {
                context.Err.WriteLine("anneal: --seeds and --jobs must be at least 1 and --time one or more positive numbers of seconds, comma-separated");
                return ExitCodes.InvalidInput;
            }

            string? objectiveText = Given(objective) ? parse.GetValue(objective) : file.Objective ?? parse.GetValue(objective);
            Objective? chosen = null;
            if (objectiveText is not null)
            {
                if (!ObjectiveNames.TryParse(objectiveText, out var o))
                {
                    context.Err.WriteLine($"anneal: unknown objective '{objectiveText}'; use {ObjectiveNames.Accepted}");
                    return ExitCodes.InvalidInput;
                }

                chosen = o;
            }

            var paths = parse.GetValue(inputs) is { Length: > 0 } given ? given : file.Instances;
            if (paths.Count == 0)
            {
                context.Err.WriteLine("anneal: give instances (files, folders or globs) or an --experiment file that lists them");
                return ExitCodes.InvalidInput;
            }

            var settings = new BenchSettings
            {
                Solvers = known,
                Seeds = seedCount,
                FirstSeed = file.FirstSeed ?? 1,
                Budgets = budgets.Distinct().ToList(),
                Iterations = Given(iterations) ? parse.GetValue(iterations) : file.Iterations,
                Objective = chosen,
                Jobs = jobCount,
            };
            string? referencePath = Given(reference) ? parse.GetValue(reference) : file.Reference;
            var refs = referencePath is { } rp ? ReferenceValues.Read(rp) : ReferenceValues.Empty;
            var loaded = InputDiscovery.Expand(paths).Select(InputLoader.Load).ToList();
            string folder = OutputFolder.Create((Given(output) ? parse.GetValue(output) : file.Out) ?? OutputFolder.Default(context.WorkingDirectory, "bench", context.Now()));
            return Execute(loaded, settings, refs, referencePath, folder, parse.GetValue(throughput), parse.GetValue(quiet), context, parse.GetValue(db));
        });
        return command;
    }

    /// <param name="db">The queue's connection string: the runs are enqueued and run by database workers; null runs them here.</param>
    public static int Execute(IReadOnlyList<LoadedInput> inputs, BenchSettings settings, ReferenceValues refs, string? referencePath, string folder, double throughputSeconds, bool quiet, CliContext context,
        string? db = null)
    {
        var w = context.Out;
        var machine = MachineInfo.Current(settings.Jobs, new DateTimeOffset(context.Now()));
        w.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"Benchmark: {inputs.Count} instance(s) × {settings.Solvers.Count} solver(s) × {settings.Seeds} seed(s) × budgets {string.Join(", ", settings.Budgets.Select(SummaryTables.Seconds))}; {settings.Jobs} at a time; reference values: {refs.Count}."));
        if (machine.Oversubscribed)
        {
            w.WriteLine($"Note: {settings.Jobs} runs at once on {machine.ProcessorCount} processors: solvers share cores, so their timings are not fair.");
        }

        machine.Append(folder);
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.Cancel);
        using var signals = context.HandleSignals ? new ShutdownSignals(stop) : null;
        var lines = new List<string>();
        if (!quiet)
        {
            w.WriteLine(Header);
        }

        void Finished(BenchRow row)
        {
            lines.Add(Format(row));
            if (!quiet)
            {
                w.WriteLine(lines[^1]);
            }
        }

        var runner = context.Services.GetRequiredService<JobRunner>();
        BenchOutcome? outcome = null;
        if (db is null)
        {
            outcome = BenchRunner.Run(runner, inputs, settings, refs, folder, Finished, null, stop.Token);
        }
        else
        {
            int code = Queue.QueueAccess.Run(context, db, checkSchema: true, async (source, _) =>
            {
                outcome = await new QueueBench(source, new Submitter(source, runner)).RunAsync(inputs, settings, refs, folder, Finished, context.Err.WriteLine, stop.Token);
                return ExitCodes.Success;
            });
            if (outcome is null)
            {
                return code;
            }
        }

        if (outcome.Skipped > 0)
        {
            w.WriteLine($"Resumed: {outcome.Skipped} of {outcome.Plan.Count} planned runs were already in results.csv and were skipped.");
        }

        if (stop.IsCancellationRequested)
        {
            w.WriteLine(db is null
                ? $"Interrupted: {outcome.Finished} run(s) finished and recorded; {outcome.Dropped} in flight were dropped; {outcome.Missing} remain. Run the same command again to continue."
                : $"Interrupted: {outcome.Finished} run(s) recorded; {outcome.Missing} remain in the queue, where workers go on with them. Run the same command again to collect them.");
        }
        else if (db is not null && outcome.Dropped > 0)
        {
            w.WriteLine($"{outcome.Dropped} run(s) failed or were cut short by a stopping worker and are not recorded; run the same command again to submit them anew.");
        }

        var stats = ExperimentReport.Write(folder, outcome, machine, referencePath);
        if (stats.Configs.Count > 0)
        {
            w.WriteLine();
            WriteTable(w, SummaryTables.Configs(stats));
        }

        if (SummaryTables.Bounds(outcome.PlanRows()) is { } bounds)
        {
            w.WriteLine();
            WriteTable(w, bounds);
        }
        if (stats.Pairs.Count > 0)
        {
            w.WriteLine();
            WriteTable(w, SummaryTables.Pairs(stats));
        }

        if (stats.WithoutReference.Count > 0)
        {
            w.WriteLine($"{stats.WithoutReference.Count} instance(s) have no reference value: their gaps are to the best found across this experiment.");
        }

        // The probe measures this machine; with --db the runs happened on the workers' machines, so it would mislead.
        if (throughputSeconds > 0 && inputs.Count > 0 && !stop.IsCancellationRequested && db is null)
        {
            var largest = inputs.MaxBy(i => i.Instance.StopCount)!.Instance;
            double rate = ThroughputProbe.EvaluationsPerSecond(largest, throughputSeconds);
            w.WriteLine(string.Create(CultureInfo.InvariantCulture, $"move evaluations: {rate / 1e6:0.00} million per second on one core ({largest.Name}, {largest.StopCount} stops)"));
        }

        w.WriteLine($"Written: {Path.Combine(folder, BenchRunner.ResultsFile)}, {HtmlSummary.FileName}, {MarkdownSummary.FileName} and pictures in {folder}");
        return stop.IsCancellationRequested ? ExitCodes.Interrupted : ExitCodes.Success;
    }

    /// <summary>A table for the console: columns padded to their widest cell.</summary>
    private static void WriteTable(TextWriter w, SummaryTable table)
    {
        var widths = table.Headers.Select(h => h.Length).ToArray();
        foreach (var row in table.Rows)
        {
            for (int i = 0; i < row.Count; i++)
            {
                widths[i] = Math.Max(widths[i], row[i].Length);
            }
        }

        string Line(IReadOnlyList<string> cells) => string.Join("  ", cells.Select((c, i) => table.Numeric[i] ? c.PadLeft(widths[i]) : c.PadRight(widths[i]))).TrimEnd();
        w.WriteLine(Line(table.Headers));
        foreach (var row in table.Rows)
        {
            w.WriteLine(Line(row));
        }
    }

    private const string Header = "instance        solver     budget  seed  vehicles      distance  feasible  t_best(s)    gap";

    private static string Format(BenchRow r) => r.BoundOnly
        ? string.Create(CultureInfo.InvariantCulture,
            $"{r.Instance,-15} {r.Solver,-10} {r.BudgetSeconds,6:0.###} {r.Seed,5} lower bound {(r.LowerBound is { } b ? b.ToString("0.00", CultureInfo.InvariantCulture) : "none")} at {r.SecondsToBest:0.0} s{(r.LowerBound is { } lb && r.Reference is { } rf && rf > 0 ? $" ({SummaryTables.Pct(lb / rf * 100)} of the reference)" : string.Empty)}")
        : string.Create(CultureInfo.InvariantCulture,
        $"{r.Instance,-15} {r.Solver,-10} {r.BudgetSeconds,6:0.###} {r.Seed,5} {r.Vehicles,9} {r.Distance,13:0.00}  {(r.Feasible ? "yes" : "NO"),-8} {r.SecondsToBest,9:0.0} {(r.GapPercent is { } g ? SummaryTables.Pct(g) : "-"),7}");
}
