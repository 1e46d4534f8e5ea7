using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Core.Travel;
using Anneal.Formats.Input;
using Anneal.OrTools.Bounds;

namespace Anneal.Tests.Bounds;

/// <summary>
/// The bound never exceeds a proven optimum, each under the distance rule it was proved under (values from
/// ../shared/benchmarks/bks.csv, sources named there and beside each case).
/// </summary>
public sealed class PublishedOptimaTests
{
    [SkippableTheory]
    // Optimal distances under arcs truncated to one decimal, CVRPLIB Solomon set (exact methods); Solomon (1987) instances.
    [InlineData("c101", 827.3)]
    [InlineData("r101", 1637.7)]
    public void SolomonUnderTruncatedDistances(string name, double optimum)
    {
        var instance = Truncated(InputLoader.Load(BenchmarkData.File($"solomon/{name}.txt")).Instance);
        double bound = Bound(instance, 60);
        Assert.True(bound <= optimum, $"{name}: bound {bound} > proven optimum {optimum}");
        Assert.True(bound >= 0.97 * optimum, $"{name}: bound {bound} is weaker than expected (97% of {optimum})");
    }

    [SkippableFact]
    public void SolomonC101UnderDoubleDistances()
    {
        // The CVRPLIB optimal routes of c101, re-costed with double-precision distances, are feasible with
        // double-precision times (bks.csv: 828.94, "feasible ... True"): a plan, so the optimum is at most its cost.
        var loaded = InputLoader.Load(BenchmarkData.File("solomon/c101.txt"));
        var plan = RouteFileReader.Read(BenchmarkData.File("solomon/c101.distance-only.sol"), loaded.Instance);
        var judged = PlanEvaluator.Evaluate(loaded.Instance, plan);
        Assert.True(judged.Feasible);
        double bound = Bound(loaded.Instance, 60);
        Assert.True(bound <= judged.Objective, $"bound {bound} > {judged.Objective}, the cost of a feasible plan");
    }

    [SkippableFact]
    public void CvrpA32()
    {
        // A-n32-k5: optimal 784 under TSPLIB EUC_2D (Augerat et al. 1995; CVRPLIB).
        var instance = InputLoader.Load(BenchmarkData.File("cvrp/A-n32-k5.vrp")).Instance;
        double bound = Bound(instance, 60);
        Assert.True(bound <= 784, $"bound {bound} > 784");
    }

    [SkippableFact]
    public void InterruptedRunStillReturnsAValidBound()
    {
        // X-n101-k25: optimal 27591 under EUC_2D (Uchoa et al. 2017; CVRPLIB). The run is stopped as soon as it
        // reports its first bound, whatever the machine's speed (a timer let a fast machine finish first).
        var instance = InputLoader.Load(BenchmarkData.File("cvrp/X-n101-k25.vrp")).Instance;
        using var cancel = new CancellationTokenSource();
        var result = new BoundSolver().Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(60) }, new CancelOnReport(cancel), cancel.Token);
        Assert.Equal(SolverStatus.Interrupted, result.Status);
        Assert.NotNull(result.LowerBound);
        Assert.True(result.LowerBound!.Value <= 27591, $"bound {result.LowerBound} > 27591");
        Assert.True(result.LowerBound.Value > 0);
    }

    /// <summary>Stops the run at its first reported point (the trace reports synchronously on the solver's thread).</summary>
    private sealed class CancelOnReport(CancellationTokenSource cancel) : IProgress<TracePoint>
    {
        public void Report(TracePoint value) => cancel.Cancel();
    }

    private static double Bound(Instance instance, double seconds)
    {
        var result = new BoundSolver().Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(seconds) }, null, default);
        Assert.NotNull(result.LowerBound);
        return result.LowerBound!.Value;
    }

    /// <summary>The same instance with each arc's distance and travel time truncated to one decimal, the rule of the exact methods.</summary>
    private static Instance Truncated(Instance instance)
    {
        int n = instance.Travel.Count;
        var x = new double[n];
        var y = new double[n];
        var distance = new double[n * n];
        for (int a = 0; a < n; a++)
        {
            for (int b = 0; b < n; b++)
            {
                distance[(a * n) + b] = Math.Floor(instance.Travel.Distance(a, b) * 10) / 10;
            }
        }

        return new Instance(instance.Name, instance.Stops, instance.Depots, instance.Vehicles, instance.DimensionNames, instance.EquipmentNames,
            instance.Rules, instance.Objective, TravelTable.FromMatrix(x, y, distance, (double[])distance.Clone()), instance.Units);
    }
}
