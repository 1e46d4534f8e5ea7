using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.Tests.Search;

/// <summary>Simulated annealing and tabu search: optimal on tiny instances, reproducible, and stoppable.</summary>
public sealed class MetaheuristicTests
{
    public static TheoryData<string, int> OptimumCases()
    {
        var data = new TheoryData<string, int>();
        foreach (var solver in new[] { "sa", "tabu" })
        {
            for (int seed = 0; seed < 8; seed++)
            {
                data.Add(solver, seed);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(OptimumCases))]
    public void FindsTheEnumeratedOptimumOnTinyInstances(string solver, int seed)
    {
        // Reference: exhaustive enumeration of every plan (BruteForce), judged by the evaluator.
        var rng = new Random(500 + seed);
        var instance = RandomInstances.Create(rng, rng.Next(5, 8), 2, hardWindows: seed % 2 == 0, dims: 1 + (seed % 2), heterogeneous: seed % 3 == 0);
        var optimum = BruteForce.Best(instance);
        var options = new SolveOptions { TimeLimit = TimeSpan.FromMinutes(5), IterationLimit = solver == "sa" ? 300_000 : 3_000, Seed = seed };
        var result = Hosting.Catalog.Create(solver).Solve(instance, options, null, CancellationToken.None);
        var found = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.Equal(optimum.Feasible, found.Feasible);
        Assert.True(Math.Abs(found.Objective - optimum.Objective) <= 1e-6 * Math.Max(1, Math.Abs(optimum.Objective)),
            $"{solver} found {found.Objective}, the enumerated optimum is {optimum.Objective} ({instance.Objective}, {instance.StopCount} stops)");
    }

    [Theory]
    [InlineData("sa")]
    [InlineData("tabu")]
    public void SameSeedAndIterationLimitGiveTheSameRoutes(string solver)
    {
        var instance = RandomInstances.Create(new Random(77), 40, 6, hardWindows: true, dims: 2);
        var options = new SolveOptions { TimeLimit = TimeSpan.FromMinutes(5), IterationLimit = solver == "sa" ? 200_000 : 400, Seed = 9 };
        var first = Hosting.Catalog.Create(solver).Solve(instance, options, null, CancellationToken.None);
        var second = Hosting.Catalog.Create(solver).Solve(instance, options, null, CancellationToken.None);
        Assert.Equal(Describe(first), Describe(second));
        var other = Hosting.Catalog.Create(solver).Solve(instance, options with { Seed = 10 }, null, CancellationToken.None);
        Assert.NotEqual(Describe(first) + first.Trace.Count, Describe(other) + other.Trace.Count);
    }

    [Theory]
    [InlineData("sa")]
    [InlineData("tabu")]
    public void CancellationReturnsTheBestPlanSoFarWithATrace(string solver)
    {
        var instance = RandomInstances.Create(new Random(5), 60, 8, hardWindows: false, dims: 1);
        using var cancel = new CancellationTokenSource(TimeSpan.FromMilliseconds(300));
        var result = Hosting.Catalog.Create(solver).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromMinutes(10) }, null, cancel.Token);
        Assert.Equal(SolverStatus.Interrupted, result.Status);
        Assert.Empty(result.Plan.StructureErrors(instance));
        Assert.NotEmpty(result.Trace);
        var judged = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.True(judged.Objective <= result.Trace[0].BestObjective + 1e-6, "the plan is no worse than the construction");
    }

    [Theory]
    [InlineData("sa")]
    [InlineData("tabu")]
    public void ThreadsRunIndependentSeedsAndKeepTheBest(string solver)
    {
        var instance = RandomInstances.Create(new Random(21), 25, 4, hardWindows: true);
        long iterations = solver == "sa" ? 50_000 : 200;
        var options = new SolveOptions { TimeLimit = TimeSpan.FromMinutes(5), IterationLimit = iterations, Seed = 3 };
        var single = new[] { 3, 1003 }.Select(seed => PlanEvaluator.Evaluate(instance,
            Hosting.Catalog.Create(solver).Solve(instance, options with { Seed = seed }, null, CancellationToken.None).Plan)).ToList();
        var both = Hosting.Catalog.Create(solver).Solve(instance, options with { Threads = 2 }, null, CancellationToken.None);
        var judged = PlanEvaluator.Evaluate(instance, both.Plan);
        Assert.Contains(both.Notes!, n => n.Contains("best of 2", StringComparison.Ordinal));
        var expected = single[1].IsBetterThan(single[0]) ? single[1] : single[0];
        Assert.Equal(expected.Objective, judged.Objective, 6);
    }

    private static string Describe(SolverResult r) =>
        string.Join(" | ", r.Plan.Routes.Select(route => route.Vehicle + ":" + string.Join(",", route.Stops)));
}
