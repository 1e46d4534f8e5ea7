using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Search.Running;

/// <summary>A solver's result with the evaluator's verdict on its plan.</summary>
public sealed record JudgedResult(SolverResult Result, PlanEvaluation Evaluation)
{
    /// <summary>The verdict to rank, or null when the solver found no plan.</summary>
    public PlanEvaluation? Ranked => Result.HasPlan ? Evaluation : null;
}

/// <summary>All solvers' results and the plan chosen among them (in <see cref="PlanRanking"/>'s order).</summary>
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
