using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Core.Solving;

/// <summary>Runs several solvers side by side on one instance with the same wall-clock budget.</summary>
public static class RunCoordinator
{
    /// <param name="solvers">Solver k runs with seed + k. One that declines the instance is not started.</param>
    /// <param name="progress">Receives (solver name, trace point) from every solver as it improves.</param>
    /// <param name="judge">Judges each result (the host's may also offer a better form of an infeasible plan); by default the evaluator's verdict on the plan as it is.</param>
    public static RunOutcome Run(
        Instance instance,
        IReadOnlyList<ISolver> solvers,
        SolveOptions options,
        Action<string, TracePoint>? progress,
        CancellationToken cancel,
        Func<Instance, SolverResult, JudgedResult>? judge = null)
    {
        judge ??= static (instance, result) => new JudgedResult(result, PlanEvaluator.Evaluate(instance, result.Plan));
        var results = new SolverResult[solvers.Count];
        var threads = new List<Thread>(solvers.Count);
        for (int k = 0; k < solvers.Count; k++)
        {
            var solver = solvers[k];
            if (solver.Declines(instance) is { } reason)
            {
                results[k] = SolverResult.Declined(solver.Name, reason);
                continue;
            }

            int index = k;
            var own = options with { Seed = options.Seed + index };
            IProgress<TracePoint>? sink = progress is null ? null : new SynchronousProgress(p => progress(solver.Name, p));
            threads.Add(new Thread(() => results[index] = solver.Solve(instance, own, sink, cancel))
            {
                IsBackground = true,
                Name = "solver " + solver.Name,
            });
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
            judged[k] = judge(instance, results[k]);
        }

        return new RunOutcome(judged, Choose(judged)) { Interrupted = cancel.IsCancellationRequested };
    }

    /// <summary>The first result that no later one beats in <see cref="PlanRanking"/>'s order; a solver without a plan is never chosen over one with.</summary>
    public static int Choose(IReadOnlyList<JudgedResult> judged)
    {
        var ranked = new PlanEvaluation?[judged.Count];
        for (int k = 0; k < ranked.Length; k++)
        {
            ranked[k] = judged[k].Ranked;
        }

        return PlanRanking.Best(ranked);
    }

    private sealed class SynchronousProgress(Action<TracePoint> report) : IProgress<TracePoint>
    {
        public void Report(TracePoint value) => report(value);
    }
}
