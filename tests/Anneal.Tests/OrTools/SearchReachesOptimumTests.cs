using Anneal.Core.Evaluation;
using Anneal.OrTools;
using Anneal.Core.Solving;

namespace Anneal.Tests.OrTools;

/// <summary>
/// Our metaheuristics reach the CP-SAT proven optimum on 10–12-stop instances within a fixed iteration budget.
/// The seeds are ones CP-SAT proves in under a second on two workers (about half of the random ones at this size
/// need longer: soft windows and per-hour costs give it weak bounds); every objective and both window kinds appear.
/// </summary>
public sealed class SearchReachesOptimumTests
{
    public static TheoryData<string, int, int> Cases()
    {
        var data = new TheoryData<string, int, int>();
        foreach (string solver in new[] { "sa", "tabu" })
        {
            foreach (var (seed, stops) in new[] { (33, 10), (34, 11), (35, 12), (45, 10), (47, 12) })
            {
                data.Add(solver, seed, stops);
            }
        }

        return data;
    }

    [SkippableTheory]
    [MemberData(nameof(Cases))]
    public void ReachesProvenOptimum(string solverName, int seed, int stops)
    {
        Skip.IfNot(Hosting.Catalog.Exists(solverName), $"solver {solverName} is not registered");
        var instance = TinyInstances.Random(seed, stops, 2);
        var exact = new ExactSolver(new ExactSettings { Workers = 2 }).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(20) }, null, default); // a ceiling: these prove in under 1 s
        Skip.IfNot(exact.Status == SolverStatus.Optimal, $"CP-SAT did not prove optimality in time ({exact.Status})");
        double optimum = PlanEvaluator.Evaluate(instance, exact.Plan).Objective;

        // An iteration of tabu search scans the whole granular neighbourhood; one of annealing tries one move.
        long iterations = solverName == "tabu" ? 4_000 : 300_000;
        var result = Hosting.Catalog.Create(solverName).Solve(instance, new SolveOptions { IterationLimit = iterations, TimeLimit = TimeSpan.FromMinutes(5), Seed = 1 }, null, default);
        var judged = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.True(judged.Feasible);
        Assert.True(judged.Objective <= optimum + (1e-4 * Math.Max(1, optimum)),
            $"{solverName} on seed {seed} ({instance.Objective}): {judged.Objective}, proven optimum {optimum}");
    }
}
