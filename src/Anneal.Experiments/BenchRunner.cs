using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Jobs;

namespace Anneal.Experiments;

/// <summary>
/// Runs an experiment plan (instances × budgets × seeds × solvers), one solver per run, judging every plan with the
/// evaluator. Each finished run's trace is written first, then its row is added to results.csv (rewritten whole and
/// atomically), so a row never points at a missing trace. Runs whose key is already in results.csv are skipped: an
/// interrupted experiment continues where it stopped. A run still in flight when the experiment is cancelled is
/// dropped, not recorded: its plan came from a cut-short budget, and recording it would pass it off as finished.
/// </summary>
public static class BenchRunner
{
    public const string ResultsFile = "results.csv";
    public const string TraceFolder = "traces";

    /// <summary>The full plan, in the order runs are started: instance, budget, seed, solver.</summary>
    public static IReadOnlyList<PlannedRun> Plan(IReadOnlyList<LoadedInput> inputs, BenchSettings settings)
    {
        var plan = new List<PlannedRun>();
        foreach (var input in inputs)
        {
            var instance = input.Instance.With(objective: settings.Objective ?? input.Settings.Objective ?? input.Instance.Objective);
            foreach (double budget in settings.Budgets)
            {
                for (int s = 0; s < settings.Seeds; s++)
                {
                    foreach (var solver in settings.Solvers)
                    {
                        plan.Add(new PlannedRun(input, instance, solver, settings.FirstSeed + s, budget));
                    }
                }
            }
        }

        return plan;
    }

    /// <param name="runner">The job runner every run goes through, as `solve` and the worker do.</param>
    public static BenchOutcome Run(
        JobRunner runner,
        IReadOnlyList<LoadedInput> inputs,
        BenchSettings settings,
        ReferenceValues references,
        string outDir,
        Action<BenchRow>? finished,
        Action<string, TracePoint>? progress,
        CancellationToken cancel)
    {
        Directory.CreateDirectory(Path.Combine(outDir, TraceFolder));
        string resultsPath = Path.Combine(outDir, ResultsFile);
        var rows = ResultsCsv.Read(resultsPath).ToList();
        var done = new HashSet<RunKey>(rows.Select(RunKey.Of));
        var plan = Plan(inputs, settings);
        var work = plan.Where(p => !done.Contains(RunKey.Of(p))).ToList();
        int skipped = plan.Count - work.Count, recorded = 0, dropped = 0;

        int next = -1;
        var gate = new object();
        Exception? failure = null;
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        void Worker()
        {
            while (!stop.IsCancellationRequested)
            {
                int k = Interlocked.Increment(ref next);
                if (k >= work.Count)
                {
                    return;
                }

                try
                {
                    var row = RunOne(runner, work[k], settings, references, outDir, progress, stop.Token);
                    lock (gate)
                    {
                        if (row is null)
                        {
                            dropped++;
                            continue;
                        }

                        rows.Add(row);
                        recorded++;
                        ResultsCsv.Write(resultsPath, rows);
                        finished?.Invoke(row);
                    }
                }
                catch (Exception e)
                {
                    // One failing run stops the others; the error is raised on the caller's thread.
                    lock (gate)
                    {
                        failure ??= e;
                    }

                    stop.Cancel();
                    return;
                }
            }
        }

        var threads = Enumerable.Range(0, Math.Clamp(settings.Jobs, 1, Math.Max(1, work.Count))).Select(_ => new Thread(Worker) { IsBackground = true }).ToList();
        threads.ForEach(t => t.Start());
        threads.ForEach(t => t.Join());
        if (failure is not null)
        {
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Throw(failure);
        }

        return new BenchOutcome(rows, plan, skipped, recorded, dropped);
    }

    /// <summary>One run; null when it was cancelled before it ended by itself (its result is not a finished run).</summary>
    private static BenchRow? RunOne(JobRunner runner, PlannedRun run, BenchSettings settings, ReferenceValues references, string outDir, Action<string, TracePoint>? progress, CancellationToken cancel)
    {
        var instance = run.Instance;
        var request = new JobRequest
        {
            Solvers = run.Solver,
            TimeSeconds = run.BudgetSeconds,
            Iterations = settings.Iterations,
            Objective = instance.Objective,
            Seed = run.Seed,
        };
        Action<string, TracePoint>? relay = progress is null ? null : (_, p) => progress($"{instance.Name}/{run.Solver}/{run.Seed}", p);
        var judged = runner.Run(run.Input, request, relay, cancel).Outcome.Results[0];
        if (cancel.IsCancellationRequested)
        {
            return null;
        }

        var (result, evaluation) = (judged.Result, judged.Evaluation);
        string traceFile = TraceFile(run);
        TraceCsvWriter.Write(Path.Combine(outDir, traceFile), TraceCsvWriter.Rows(run.Solver, result.Trace));
        var measure = new RunMeasure(evaluation.Objective, evaluation.VehiclesUsed, evaluation.Distance, evaluation.Feasible, evaluation.Routes.Count > 0,
            result.SecondsToBest, result.Seconds, result.LowerBound, result.BoundOnly);
        return Row(run, measure, references, traceFile);
    }

    /// <summary>The results.csv row of a finished run, its gap to the reference value (if any) included.</summary>
    /// <param name="traceFile">The run's trace, relative to the output folder (<see cref="TraceFile"/>).</param>
    public static BenchRow Row(PlannedRun run, RunMeasure m, ReferenceValues references, string traceFile)
    {
        var instance = run.Instance;
        var reference = references.Find(instance);
        double? gap = reference is null || !m.HasPlan ? null : (m.Distance / reference.Value - 1) * 100;
        if (instance.Objective == Objective.Cost && reference is not null)
        {
            gap = (m.ObjectiveValue / reference.Value - 1) * 100;
        }

        return new BenchRow(instance.Name, run.Solver, run.Seed, run.BudgetSeconds, run.Objective, m.ObjectiveValue,
            m.Vehicles, m.Distance, m.Feasible, m.SecondsToBest, m.Seconds, reference?.Value, reference?.Vehicles, m.BoundOnly ? null : gap, traceFile,
            m.LowerBound, m.BoundOnly);
    }

    /// <summary>traces/&lt;instance&gt;-&lt;solver&gt;-s&lt;seed&gt;-&lt;budget&gt;s-&lt;objective&gt;.csv, relative to the output folder.</summary>
    public static string TraceFile(PlannedRun run) => Path.Combine(TraceFolder, string.Create(CultureInfo.InvariantCulture,
        $"{Safe(run.Instance.Name)}-{Safe(run.Solver)}-s{run.Seed}-{RunKey.BudgetText(run.BudgetSeconds)}s-{run.Objective}.csv"));

    private static string Safe(string name)
    {
        var chars = name.ToCharArray();
        for (int i = 0; i < chars.Length; i++)
        {
            if (!char.IsLetterOrDigit(chars[i]) && chars[i] != '-' && chars[i] != '_' && chars[i] != '.')
            {
                chars[i] = '_';
            }
        }

        return new string(chars);
    }
}
