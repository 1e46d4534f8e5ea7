using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.OrTools;
using Anneal.OrTools.Bounds;
using Anneal.Core.Solving;

namespace Anneal.Tests.Bounds;

/// <summary>The `bound` solver's result never exceeds the optimum, found here by enumeration (BruteForce).</summary>
public sealed class BoundSolverTests
{
    public static TheoryData<int> Seeds => new() { 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12 };

    [Theory]
    [MemberData(nameof(Seeds))]
    public void NeverAboveTheOptimumOfRoughInstances(int seed)
    {
        // Several windows per stop, two dimensions, double-precision distances, soft and hard rules at random.
        AtMostOptimum(BoundInstances.Random(seed, 6, 3), seed);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void NeverAboveTheOptimumOfTinyInstances(int seed) => AtMostOptimum(TinyInstances.Random(seed, 7, 2), seed);

    [Theory]
    [InlineData(21, 10, 3)]
    [InlineData(22, 11, 3)]
    [InlineData(23, 12, 3)]
    [InlineData(24, 12, 2)]
    public void NeverAboveWhatTheExactModelFinds(int seed, int stops, int vehicles)
    {
        // Any plan that keeps the hard rules costs at least the optimum; CP-SAT's plan is the optimum when proven.
        var instance = TinyInstances.Random(seed, stops, vehicles);
        var exact = new ExactSolver(new ExactSettings { Workers = 2 }).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(4) }, null, default);
        var bound = new BoundSolver().Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(10) }, null, default);
        var judged = PlanEvaluator.Evaluate(instance, exact.Plan);
        if (!exact.HasPlan || !judged.Feasible)
        {
            return;
        }

        Assert.NotNull(bound.LowerBound);
        Assert.True(bound.LowerBound!.Value <= judged.Objective + 1e-9, $"seed {seed}: bound {bound.LowerBound} > plan {judged.Objective} ({exact.Status})");
    }

    [Fact]
    public void OffersNoPlanAndIsNeverChosen()
    {
        var instance = TinyInstances.Random(3, 6, 2);
        var outcome = RunCoordinator.Run(instance, [Hosting.Catalog.Create("bound"), Hosting.Catalog.Create("insertion")], new SolveOptions { TimeLimit = TimeSpan.FromSeconds(5) }, null, default);
        Assert.True(outcome.Results[0].Result.BoundOnly);
        Assert.Empty(outcome.Results[0].Result.Plan.Routes);
        Assert.Equal("insertion", outcome.Best.Result.Solver);
    }

    private static void AtMostOptimum(Anneal.Core.Model.Instance instance, int seed)
    {
        var truth = BruteForce.Optimum(instance);
        var result = new BoundSolver().Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(10) }, null, default);
        Assert.True(result.BoundOnly);
        if (truth is null)
        {
            return; // no plan keeps the hard rules: any bound is vacuously valid
        }

        Assert.NotNull(result.LowerBound);
        double optimum = truth.Value.Objective;
        Assert.True(result.LowerBound!.Value <= optimum, $"seed {seed} ({instance.Objective}): bound {result.LowerBound} > optimum {optimum}; {string.Join("; ", result.Notes ?? [])}");
        Assert.Equal(PlanEvaluator.Evaluate(instance, Plan.Empty).Routes.Count, result.Plan.Routes.Count);
    }
}
