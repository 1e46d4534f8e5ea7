using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;
using Anneal.Search.Strategy;

namespace Anneal.Tests.Search.Strategy;

public class FleetPhaseTests
{
    [Fact]
    public void WithoutVehicleCostsThereIsOnlyTheDistancePhase()
    {
        var phase = new FleetPhase(reduceVehicles: false, share: 0.5, patience: 0.2);
        Assert.False(phase.Eliminating);
        Assert.False(phase.Due(0.9));
        Assert.Equal(0.25, phase.Within(0.25), 12);
    }

    [Fact]
    public void TheFleetPhaseEndsAtItsShareOrWhenNoFewerRoutesTurnUp()
    {
        var byShare = new FleetPhase(reduceVehicles: true, share: 0.5, patience: 1.0);
        Assert.False(byShare.Due(0.49));
        Assert.True(byShare.Due(0.5));

        var byPatience = new FleetPhase(reduceVehicles: true, share: 0.9, patience: 0.2);
        Assert.False(byPatience.Due(0.19));
        Assert.True(byPatience.Due(0.21));
    }

    [Fact]
    public void TheFleetIsHeldOnlyInTheDistancePhaseOfARunWhereVehiclesCost()
    {
        Assert.False(new FleetPhase(reduceVehicles: false, share: 0.5, patience: 0.2).HoldsFleet);
        var phase = new FleetPhase(reduceVehicles: true, share: 0.5, patience: 0.2);
        Assert.False(phase.HoldsFleet);
        phase.BeginDistance(0.3);
        Assert.True(phase.HoldsFleet);
    }

    [Theory]
    [InlineData(false, false, false, 5.0, false)]
    [InlineData(true, false, true, -1.0, false)]
    [InlineData(true, false, true, 1.0, true)]
    [InlineData(true, false, false, -1.0, true)]
    [InlineData(false, true, true, 1.0, false)]
    [InlineData(false, true, false, -1.0, true)]
    public void HoldingTheFleetRefusesOnlyRouteChangesThatBreakRulesOrCostMore(bool opens, bool empties, bool feasibleAfter, double change, bool refused)
    {
        Assert.Equal(refused, FleetPhase.Refuses(opens, empties, feasibleAfter, change));
    }

    [Fact]
    public void EachPhaseCoolsOverItsOwnSpan()
    {
        var phase = new FleetPhase(reduceVehicles: true, share: 0.5, patience: 0.2);
        Assert.Equal(0.6, phase.Within(0.3), 12);
        Assert.Equal(1.0, phase.Within(0.5), 12);
        phase.BeginDistance(0.4);
        Assert.False(phase.Eliminating);
        Assert.False(phase.Due(0.95));
        Assert.Equal(0.0, phase.Within(0.4), 12);
        Assert.Equal(0.5, phase.Within(0.7), 12);
        Assert.Equal(1.0, phase.Within(1.0), 12);
    }

    // Solomon r101 (Solomon 1987), read from ../shared/benchmarks: emptying a route and repairing must give back
    // a plan that serves every stop within the hard windows and capacity, as the exact evaluator judges it.
    [SkippableFact]
    public void RepairAfterEliminationServesEveryStopFeasibly()
    {
        var path = BenchmarkData.File("solomon/r101.txt");
        var instance = SolomonReader.Parse(File.ReadAllText(path), "r101.txt").With(objective: Objective.VehiclesThenDistance);
        var candidates = new CandidateLists(instance, 30);
        var state = InsertionSolver.Build(instance, candidates);
        var keeper = new BestKeeper(state);
        keeper.Offer(state);
        var adapter = new PenaltyAdapter(InitialWeights.For(instance, 10), 0.2, 1e-3, InitialWeights.Ceiling(instance));
        state.SetWeights(adapter.Weights);
        int routesBefore = state.UsedRoutes;

        keeper.Reset(state, new SearchRandom(1), static (s, rng) => Assert.True(RouteElimination.EmptyAShortRoute(s, rng)));
        Assert.True(state.UnservedCount > 0);
        Restart.Repair(state, keeper, adapter, candidates);

        Assert.Equal(0, state.UnservedCount);
        var truth = PlanEvaluator.Evaluate(instance, state.ToPlan());
        Assert.True(truth.Feasible, string.Join("; ", truth.Violations.Select(v => v.Message)));
        Assert.True(truth.VehiclesUsed <= routesBefore + 1, $"repair used {truth.VehiclesUsed} routes, the plan had {routesBefore}");
    }
}
