using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Search.Running;

namespace Anneal.Experiments;

/// <summary>
/// Runs solvers × instances × seeds, one solver per run, judging every plan with the evaluator, and keeps
/// results.csv and each run's trace up to date in the output folder as runs finish.
/// </summary>
public static class BenchRunner
{
    public const string ResultsFile = "results.csv";
    public const string TraceFolder = "traces";

    public static IReadOnlyList<BenchRow> Run(
        IReadOnlyList<LoadedInput> inputs,
        BenchSettings settings,
        ReferenceValues references,
        string outDir,
        Action<BenchRow>? finished,
        Action<string, TracePoint>? progress,
        CancellationToken cancel)
    {
        Directory.CreateDirectory(Path.Combine(outDir, TraceFolder));
        var work = new List<(Instance Instance, string Solver, int Seed)>();
        foreach (var input in inputs)
        {
            var instance = settings.Objective is { } o ? input.Instance.With(objective: o) : input.Instance.With(objective: input.Settings.Objective ?? input.Instance.Objective);
            for (int s = 0; s < settings.Seeds; s++)
            {
                foreach (var solver in settings.Solvers)
                {
                    work.Add((instance, solver, settings.FirstSeed + s));
                }
            }
        }

        var rows = new BenchRow?[work.Count];
        int next = -1;
        var gate = new object();
        void Worker()
        {
            while (!cancel.IsCancellationRequested)
            {
                int k = Interlocked.Increment(ref next);
                if (k >= work.Count)
                {
                    return;
                }

                var (instance, solver, seed) = work[k];
                var row = RunOne(instance, solver, seed, settings, references, outDir, progress, cancel);
                lock (gate)
                {
                    rows[k] = row;
                    ResultsCsv.Write(Path.Combine(outDir, ResultsFile), rows.Where(r => r is not null)!);
                    finished?.Invoke(row);
                }
            }
        }

        var threads = Enumerable.Range(0, Math.Max(1, settings.Jobs)).Select(_ => new Thread(Worker) { IsBackground = true }).ToList();
        threads.ForEach(t => t.Start());
        threads.ForEach(t => t.Join());
        return rows.Where(r => r is not null).Select(r => r!).ToList();
    }

    private static BenchRow RunOne(Instance instance, string solverName, int seed, BenchSettings settings, ReferenceValues references, string outDir, Action<string, TracePoint>? progress, CancellationToken cancel)
    {
        var solver = SolverCatalog.Create(solverName);
        var options = new SolveOptions { TimeLimit = TimeSpan.FromSeconds(settings.Seconds), IterationLimit = settings.Iterations, Seed = seed };
        IProgress<TracePoint>? sink = progress is null ? null : new Relay(p => progress($"{instance.Name}/{solverName}/{seed}", p));
        var result = solver.Solve(instance, options, sink, cancel);
        var evaluation = PlanEvaluator.Evaluate(instance, result.Plan);
        var reference = references.Find(instance);
        double? gap = reference is null || evaluation.Routes.Count == 0 ? null : (evaluation.Distance / reference.Value - 1) * 100;
        if (instance.Objective == Objective.Cost && reference is not null)
        {
            gap = (evaluation.Objective / reference.Value - 1) * 100;
        }

        string traceName = string.Create(CultureInfo.InvariantCulture, $"{Safe(instance.Name)}-{solverName}-s{seed}-{settings.Seconds:0.###}s.csv");
        TraceCsvWriter.Write(Path.Combine(outDir, TraceFolder, traceName),
            result.Trace.Select(p => new TraceRow(solverName, p.Seconds, p.Iteration, p.BestObjective, p.CurrentObjective, p.BestFeasible, p.State)));
        return new BenchRow(instance.Name, solverName, seed, settings.Seconds, instance.Objective.ToText(), evaluation.Objective,
            evaluation.VehiclesUsed, evaluation.Distance, evaluation.Feasible, result.SecondsToBest, result.Seconds,
            reference?.Value, reference?.Vehicles, gap, Path.Combine(TraceFolder, traceName));
    }

    private static string Safe(string name)
    {
        var chars = name.ToCharArray();
        for (int i = 0; i < chars.Length; i++)
        {
            if (!char.IsLetterOrDigit(chars[i]) && chars[i] != '-' && chars[i] != '_')
            {
                chars[i] = '_';
            }
        }

        return new string(chars);
    }

    private sealed class Relay(Action<TracePoint> report) : IProgress<TracePoint>
    {
        public void Report(TracePoint value) => report(value);
    }
}
