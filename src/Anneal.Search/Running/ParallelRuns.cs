using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.Search.Running;

/// <summary>Runs independent seeded copies of a solver on separate threads and keeps the best plan.</summary>
public static class ParallelRuns
{
    public static SolverResult Run(Func<ISolver> create, Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        int n = options.Threads;
        var results = new SolverResult[n];
        var threads = new Thread[n];
        for (int k = 0; k < n; k++)
        {
            int index = k;
            var own = options with { Threads = 1, Seed = options.Seed + (1000 * index) };
            threads[k] = new Thread(() => results[index] = create().Solve(instance, own, index == 0 ? progress : null, cancel)) { IsBackground = true };
            threads[k].Start();
        }

        foreach (var t in threads)
        {
            t.Join();
        }

        var judged = new PlanEvaluation?[n];
        for (int k = 0; k < n; k++)
        {
            judged[k] = results[k].HasPlan ? PlanEvaluator.Evaluate(instance, results[k].Plan) : null;
        }

        int best = PlanRanking.Best(judged);
        if (!results[best].HasPlan)
        {
            return results[best];
        }

        var notes = new List<string>(results[best].Notes ?? []) { $"best of {n} independent runs (seeds {options.Seed} + 1000·k)" };
        return results[best] with { Notes = notes };
    }
}
