using Anneal.Core.Evaluation;
using Anneal.Core.Solving;
using Anneal.OrTools;

namespace Anneal.Tests.OrTools;

/// <summary>
/// exact (CP-SAT) on tiny jobs with collect-and-deliver pairs and returns: its proven optimum equals the optimum by
/// enumeration (BruteForce, judged by PlanEvaluator), and neither metaheuristic returns a plan better than it.
/// </summary>
public sealed class ExactPickupTests
{
    [Theory]
    [InlineData(1, 7, 2)]
    [InlineData(2, 7, 2)]
    [InlineData(3, 6, 3)]
    [InlineData(4, 8, 2)]
    [InlineData(5, 7, 2)]
    public void Exact_equals_enumeration_with_pairs_and_returns_and_no_metaheuristic_beats_it(int seed, int stops, int vehicles)
    {
        var instance = TinyInstances.WithPickups(seed, stops, vehicles);
        Assert.True(instance.HasPairs && instance.HasPickups);
        var truth = BruteForce.Optimum(instance);
        var result = new ExactSolver(new ExactSettings { Workers = 2 }).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(30) }, null, default); // a ceiling
        if (truth is null)
        {
            Assert.Equal(SolverStatus.NoSolution, result.Status);
            return;
        }

        Assert.Equal(SolverStatus.Optimal, result.Status);
        var judged = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.True(judged.Feasible, string.Join("; ", judged.Violations.Select(v => v.Message)));
        double tolerance = 1e-4 * Math.Max(1, truth.Value.Objective);
        Assert.True(Math.Abs(judged.Objective - truth.Value.Objective) <= tolerance,
            $"seed {seed} ({instance.Objective}): exact {judged.Objective}, enumeration {truth.Value.Objective}");
        foreach (string solver in new[] { "sa", "tabu" })
        {
            var options = new SolveOptions { TimeLimit = TimeSpan.FromMinutes(5), IterationLimit = solver == "sa" ? 200_000 : 2_000, Seed = seed };
            var found = PlanEvaluator.Evaluate(instance, Hosting.Catalog.Create(solver).Solve(instance, options, null, CancellationToken.None).Plan);
            Assert.True(!found.Feasible || found.Objective >= truth.Value.Objective - tolerance,
                $"{solver} found {found.Objective}, below the proven optimum {truth.Value.Objective}");
        }
    }
}
