using Anneal.Core.Evaluation;
using Anneal.OrTools;
using Anneal.Core.Solving;

namespace Anneal.Tests.OrTools;

/// <summary>The CP-SAT model's proven optimum equals the optimum by enumeration (BruteForce, written here).</summary>
public sealed class ExactModelTests
{
    [Theory]
    [InlineData(1, 7, 2)]
    [InlineData(2, 8, 2)]
    [InlineData(3, 7, 3)]
    [InlineData(4, 9, 2)]
    [InlineData(5, 7, 2)]
    [InlineData(6, 8, 2)]
    public void OptimumEqualsEnumeration(int seed, int stops, int vehicles)
    {
        var instance = TinyInstances.Random(seed, stops, vehicles);
        var truth = BruteForce.Optimum(instance);
        var result = new ExactSolver(new ExactSettings { Workers = 2 }).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(30) }, null, default); // a ceiling: proofs take under 2 s
        Assert.DoesNotContain(result.Notes ?? [], n => n.StartsWith("approximated: route duration", StringComparison.Ordinal));
        if (truth is null)
        {
            Assert.Equal(SolverStatus.NoSolution, result.Status);
            return;
        }

        Assert.Equal(SolverStatus.Optimal, result.Status);
        var judged = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.True(judged.Feasible);
        double tolerance = 1e-4 * Math.Max(1, truth.Value.Objective);
        Assert.True(Math.Abs(judged.Objective - truth.Value.Objective) <= tolerance,
            $"seed {seed} ({instance.Objective}): exact {judged.Objective}, enumeration {truth.Value.Objective}");
        Assert.NotNull(result.LowerBound);
        Assert.True(Math.Abs(result.LowerBound!.Value - truth.Value.Objective) <= tolerance, $"bound {result.LowerBound} vs {truth.Value.Objective}");
    }

    [Fact]
    public void DeclinesAboveItsStopLimit()
    {
        var instance = TinyInstances.Random(1, 12, 2);
        var result = new ExactSolver(new ExactSettings { StopLimit = 10 }).Solve(instance, new SolveOptions(), null, default);
        Assert.Equal(SolverStatus.Declined, result.Status);
        Assert.Equal(["12 stops, above the exact model's limit of 10"], result.Notes);
        Assert.Empty(result.Plan.Routes);
    }
}
