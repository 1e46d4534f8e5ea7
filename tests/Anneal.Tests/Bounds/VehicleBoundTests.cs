using Anneal.Bounds.Relaxation;
using Anneal.Bounds.Vehicles;
using Anneal.Core.Model;
using static Anneal.Tests.Fixtures.TinyInstances;

namespace Anneal.Tests.Bounds;

/// <summary>The vehicle count bound: capacity rounded up per dimension, cliques of stops that cannot share a route.</summary>
public sealed class VehicleBoundTests
{
    [Fact]
    public void CapacityRoundsUp()
    {
        // ⌈5 × 10 / 20⌉ = 3 (the bin-packing bound, common practice).
        var stops = Enumerable.Range(1, 5).Select(i => Stop("s" + i, i, demand: 10)).ToArray();
        var vehicles = Enumerable.Range(1, 4).Select(i => Vehicle("v" + i, capacity: 20)).ToArray();
        var count = VehicleBound.Compute(RelaxedInstance.Build(Line(stops, vehicles, RuleSet.AllHard)));
        Assert.Equal(3, count.Vehicles);
    }

    [Fact]
    public void CapacityAllowsTheEvaluatorsTolerance()
    {
        // 40 + 4e-7 on vehicles of 20: the evaluator calls an overload of at most 1e-6 feasible, so two vehicles may do.
        var stops = new[] { Stop("a", 1, demand: 20 + 2e-7), Stop("b", 2, demand: 20 + 2e-7) };
        var vehicles = Enumerable.Range(1, 3).Select(i => Vehicle("v" + i, capacity: 20)).ToArray();
        var instance = Line(stops, vehicles, RuleSet.AllHard);
        Assert.Equal(2, VehicleBound.Compute(RelaxedInstance.Build(instance)).Vehicles);
    }

    [Fact]
    public void OptionalStopsNeedNoVehicle()
    {
        var stops = new[] { Stop("a", 1, demand: 15), Stop("b", 2, demand: 15, optional: true, penalty: 10), Stop("c", 3, demand: 15, optional: true, penalty: 10) };
        var vehicles = Enumerable.Range(1, 3).Select(i => Vehicle("v" + i, capacity: 20)).ToArray();
        Assert.Equal(1, VehicleBound.Compute(RelaxedInstance.Build(Line(stops, vehicles, RuleSet.AllHard))).Vehicles);
    }

    [Fact]
    public void StopsWhoseWindowsClashNeedOneVehicleEach()
    {
        // Four stops at one place, each to be served from 50 to 60 for 100 minutes: after one, the others have closed.
        var stops = Enumerable.Range(1, 4).Select(i => Stop("s" + i, 50, open: 50, close: 60) with { ServiceTime = 100 }).ToArray();
        var vehicles = Enumerable.Range(1, 5).Select(i => Vehicle("v" + i, capacity: 100)).ToArray();
        var count = VehicleBound.Compute(RelaxedInstance.Build(Line(stops, vehicles, RuleSet.AllHard)));
        Assert.Equal(4, count.Vehicles);
        Assert.Contains("cannot share a route", count.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void SoftWindowsProveNothingAboutTime()
    {
        var stops = Enumerable.Range(1, 4).Select(i => Stop("s" + i, 50, open: 50, close: 60) with { ServiceTime = 100 }).ToArray();
        var vehicles = Enumerable.Range(1, 5).Select(i => Vehicle("v" + i, capacity: 100)).ToArray();
        var rules = RuleSet.AllHard with { TimeWindows = Rule.Soft(1) };
        Assert.Equal(1, VehicleBound.Compute(RelaxedInstance.Build(Line(stops, vehicles, rules))).Vehicles);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(6)]
    [InlineData(7)]
    [InlineData(8)]
    public void NeverAboveTheFewestVehiclesOfAnyFeasiblePlan(int seed)
    {
        // Under vehicles-then-distance the optimum by enumeration uses the fewest vehicles any feasible plan can.
        var instance = BoundInstances.Random(seed, 6, 3).With(objective: Objective.VehiclesThenDistance);
        var truth = BruteForce.Optimum(instance);
        var count = VehicleBound.Compute(RelaxedInstance.Build(instance));
        if (truth is { } t)
        {
            Assert.True(count.Vehicles <= t.Plan.VehiclesUsed, $"seed {seed}: bound {count.Vehicles} > {t.Plan.VehiclesUsed} ({count.Reason})");
        }
    }
}
