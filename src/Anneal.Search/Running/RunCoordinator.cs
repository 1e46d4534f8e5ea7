using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Search.Running;

/// <summary>A solver's result with the evaluator's verdict on its plan.</summary>
public sealed record JudgedResult(SolverResult Result, PlanEvaluation Evaluation);

/// <summary>All solvers' results and the plan chosen among them (feasible first, then lowest objective).</summary>
public sealed record RunOutcome(IReadOnlyList<JudgedResult> Results, int Chosen)
{
    public JudgedResult Best => Results[Chosen];
}

/// <summary>Runs several solvers side by side on one instance with the same wall-clock budget.</summary>
public static class RunCoordinator
{
    /// <param name="progress">Receives (solver name, trace point) from every solver as it improves.</param>
    public static RunOutcome Run(
        Instance instance,
        IReadOnlyList<string> solverNames,
        SolveOptions options,
        Action<string, TracePoint>? progress,
        CancellationToken cancel)
    {
        var results = new SolverResult[solverNames.Count];
        var threads = new Thread[solverNames.Count];
        for (int k = 0; k < solverNames.Count; k++)
        {
            int index = k;
            var solver = SolverCatalog.Create(solverNames[k]);
            var own = options with { Seed = options.Seed + index };
            IProgress<TracePoint>? sink = progress is null ? null : new SynchronousProgress(p => progress(solver.Name, p));
            threads[k] = new Thread(() => results[index] = solver.Solve(instance, own, sink, cancel))
            {
                IsBackground = true,
                Name = "solver " + solver.Name,
            };
        }

        foreach (var t in threads)
        {
            t.Start();
        }

        foreach (var t in threads)
        {
            t.Join();
        }

        var judged = new JudgedResult[results.Length];
        for (int k = 0; k < results.Length; k++)
        {
            judged[k] = new JudgedResult(results[k], PlanEvaluator.Evaluate(instance, results[k].Plan));
        }

        return new RunOutcome(judged, Choose(judged));
    }

    /// <summary>Feasible plans beat infeasible ones; then the lower objective; ties go to the earlier solver.</summary>
    public static int Choose(IReadOnlyList<JudgedResult> judged)
    {
        int best = 0;
        for (int k = 1; k < judged.Count; k++)
        {
            if (judged[k].Evaluation.IsBetterThan(judged[best].Evaluation))
            {
                best = k;
            }
        }

        return best;
    }

    private sealed class SynchronousProgress(Action<TracePoint> report) : IProgress<TracePoint>
    {
        public void Report(TracePoint value) => report(value);
    }
}
