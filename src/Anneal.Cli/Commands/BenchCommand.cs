using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Core.Model;
using Anneal.Experiments;
using Anneal.Formats.Input;
using Anneal.Search.Diagnostics;
using Anneal.Search.Running;

namespace Anneal.Cli.Commands;

/// <summary>`anneal bench`: solvers × instances × seeds with one budget; a results table, gaps to reference values and the kernel's throughput.</summary>
public static class BenchCommand
{
    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Benchmark files, folders of them, or CSV job folders.", Arity = ArgumentArity.OneOrMore };
        var solvers = new Option<string>("--solvers") { Description = "Comma-separated solver names.", DefaultValueFactory = _ => "sa,tabu", HelpName = "list" };
        var seeds = new Option<int>("--seeds") { Description = "Seeds per solver and instance (1, 2, …).", DefaultValueFactory = _ => 3, HelpName = "n" };
        var time = new Option<double>("--time") { Description = "Wall-clock budget per run, seconds.", DefaultValueFactory = _ => 10, HelpName = "seconds" };
        var iterations = new Option<long?>("--iterations") { Description = "Also stop each run after this many iterations.", HelpName = "n" };
        var objective = SharedOptions.Objective();
        var reference = new Option<string?>("--reference") { Description = "CSV of best-known values (the format of ../shared/benchmarks/bks.csv); gaps are measured against it.", HelpName = "csv" };
        var jobs = new Option<int>("--jobs") { Description = "Runs at once (one solver per core keeps timings fair).", DefaultValueFactory = _ => 1, HelpName = "n" };
        var output = SharedOptions.Out("Output folder for results.csv and traces/. Default: runs/bench-<yyyyMMdd-HHmmss>.");
        var throughput = new Option<double>("--throughput-seconds") { Description = "Seconds spent measuring move evaluations per second on the largest instance (0 skips it).", DefaultValueFactory = _ => 2, HelpName = "seconds" };
        var quiet = new Option<bool>("--quiet") { Description = "No line per finished run." };
        var command = new Command("bench", "Benchmark solvers on instances: results.csv, a table with gaps to reference values, and move-evaluation throughput.");
        command.Arguments.Add(inputs);
        foreach (Option option in new Option[] { solvers, seeds, time, iterations, objective, reference, jobs, output, throughput, quiet })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var names = parse.GetValue(solvers)!.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var unknown = names.FirstOrDefault(n => !SolverCatalog.Exists(n));
            if (unknown is not null || names.Length == 0)
            {
                context.Err.WriteLine($"anneal: unknown solver '{unknown}'; known solvers: {string.Join(", ", SolverCatalog.Names.Order(StringComparer.Ordinal))}");
                return ExitCodes.InvalidInput;
            }

            if (parse.GetValue(seeds) < 1 || parse.GetValue(jobs) < 1 || !(parse.GetValue(time) > 0))
            {
                context.Err.WriteLine("anneal: --seeds and --jobs must be at least 1 and --time positive");
                return ExitCodes.InvalidInput;
            }

            Objective? chosen = null;
            if (parse.GetValue(objective) is { } text && ObjectiveNames.TryParse(text, out var o))
            {
                chosen = o;
            }

            var settings = new BenchSettings
            {
                Solvers = names,
                Seeds = parse.GetValue(seeds),
                Seconds = parse.GetValue(time),
                Iterations = parse.GetValue(iterations),
                Objective = chosen,
                Jobs = parse.GetValue(jobs),
            };
            var refs = parse.GetValue(reference) is { } path ? ReferenceValues.Read(path) : ReferenceValues.Empty;
            var loaded = InputDiscovery.Expand(parse.GetValue(inputs)!).Select(InputLoader.Load).ToList();
            string folder = OutputFolder.Create(parse.GetValue(output) ?? OutputFolder.Default(context.WorkingDirectory, "bench", context.Now()));
            return Execute(loaded, settings, refs, folder, parse.GetValue(throughput), parse.GetValue(quiet), context);
        });
        return command;
    }

    public static int Execute(IReadOnlyList<LoadedInput> inputs, BenchSettings settings, ReferenceValues refs, string folder, double throughputSeconds, bool quiet, CliContext context)
    {
        var w = context.Out;
        w.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"Benchmark: {inputs.Count} instance(s) × {settings.Solvers.Count} solver(s) × {settings.Seeds} seed(s), {settings.Seconds:0.##} s per run, {settings.Jobs} at a time; reference values: {refs.Count}."));
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.Cancel);
        using var signals = context.HandleSignals ? new ShutdownSignals(stop) : null;
        w.WriteLine(Header);
        var rows = BenchRunner.Run(inputs, settings, refs, folder, quiet ? null : row => w.WriteLine(Format(row)), null, stop.Token);
        if (quiet)
        {
            foreach (var row in rows)
            {
                w.WriteLine(Format(row));
            }
        }

        w.WriteLine();
        foreach (var line in BenchSummary.Lines(rows))
        {
            w.WriteLine(line);
        }

        if (throughputSeconds > 0 && inputs.Count > 0 && !stop.IsCancellationRequested)
        {
            var largest = inputs.MaxBy(i => i.Instance.StopCount)!.Instance;
            double rate = ThroughputProbe.EvaluationsPerSecond(largest, throughputSeconds);
            w.WriteLine(string.Create(CultureInfo.InvariantCulture, $"move evaluations: {rate / 1e6:0.00} million per second on one core ({largest.Name}, {largest.StopCount} stops)"));
        }

        w.WriteLine($"Written: {Path.Combine(folder, BenchRunner.ResultsFile)}");
        return stop.IsCancellationRequested ? ExitCodes.Interrupted : ExitCodes.Success;
    }

    private const string Header = "instance        solver      seed  vehicles      distance  feasible  t_best(s)    gap";

    private static string Format(BenchRow r) => string.Create(CultureInfo.InvariantCulture,
        $"{r.Instance,-15} {r.Solver,-10} {r.Seed,5} {r.Vehicles,9} {r.Distance,13:0.00}  {(r.Feasible ? "yes" : "NO"),-8} {r.SecondsToBest,9:0.0} {(r.GapPercent is { } g ? g.ToString("0.00", CultureInfo.InvariantCulture) + "%" : "-"),7}");
}
