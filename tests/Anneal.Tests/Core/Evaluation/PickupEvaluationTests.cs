using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Evaluation;

/// <summary>
/// The evaluator on returns and collect-and-deliver pairs: the load is checked after every stop (Dethloff 2001, OR
/// Spektrum 23(1):79-96: the largest load along the route must fit), a pair on one vehicle with the collection first
/// (Li &amp; Lim 2001). Hand-computed cases on a line of stops; each broken rule names its stop.
/// </summary>
public class PickupEvaluationTests
{
    // Depot at 0; stops on a line. A delivers 6 from the depot, B collects 8 returns, C collects 5 for D, D receives 5.
    private static Instance Line(double capacity)
    {
        Stop S(string id, double x, double demand, double pickup, int from = -1) => new()
        {
            Id = id, X = x, Y = 0, Demand = [demand], Pickup = [pickup], CollectFrom = from, Windows = [new TimeWindow(0, 1000)],
        };
        var stops = new[] { S("A", 1, 6, 0), S("B", 2, 0, 8), S("C", 3, 0, 5), S("D", 4, 5, 0, from: 2) };
        var x = stops.Select(s => s.X).Append(0).ToArray();
        var y = new double[x.Length];
        return new Instance("pickups", stops, [new Depot { Id = "depot", X = 0, Y = 0 }], [TinyInstances.Vehicle("van", capacity), TinyInstances.Vehicle("van2", capacity)],
            ["kg"], [], RuleSet.AllHard, Objective.Distance, TravelTable.Planar(x, y, roundToInteger: true), Units.Minutes);
    }

    private static PlanEvaluation Evaluate(Instance instance, params int[][] routes) =>
        PlanEvaluator.Evaluate(instance, new Plan(routes.Select((r, v) => new PlannedRoute(v, r)).ToArray()));

    [Fact]
    public void Loads_after_each_stop_follow_deliveries_and_collections()
    {
        // By hand: leaves with 6 (A's delivery only); after A 0, after B 8, after C 13, after D 8 (B's returns ride home).
        var result = Evaluate(Line(13), [0, 1, 2, 3]);

        Assert.True(result.Feasible, string.Join("; ", result.Violations.Select(v => v.Message)));
        Assert.Equal([0.0, 8, 13, 8], result.Routes[0].LoadAfter.Select(l => l[0]));
    }

    [Fact]
    public void An_overload_in_the_middle_of_the_route_is_reported_at_its_stop()
    {
        // The route total (6 out, 8 back) fits 12; the peak of 13 after C does not: 1 over (hand computation).
        var result = Evaluate(Line(12), [0, 1, 2, 3]);

        var v = Assert.Single(result.Violations);
        Assert.Equal(RuleKind.Capacity, v.Rule);
        Assert.Equal("C", v.Stop);
        Assert.Equal(1, v.Amount, 9);
        Assert.Contains("after stop C (position 3)", v.Message, StringComparison.Ordinal);
        Assert.False(result.Feasible);
    }

    [Fact]
    public void A_delivery_before_its_collection_is_reported_with_both_stops()
    {
        var result = Evaluate(Line(20), [0, 1, 3, 2]);

        var v = Assert.Single(result.Violations);
        Assert.Equal(RuleKind.Pair, v.Rule);
        Assert.Equal("D", v.Stop);
        Assert.Contains("before stop C", v.Message, StringComparison.Ordinal);
        Assert.False(result.Feasible);
    }

    [Fact]
    public void A_pair_split_over_two_vehicles_is_reported()
    {
        var result = Evaluate(Line(20), [0, 1, 2], [3]);

        var v = Assert.Single(result.Violations);
        Assert.Equal(RuleKind.Pair, v.Rule);
        Assert.Equal("D", v.Stop);
        Assert.Contains("C is on vehicle van", v.Message, StringComparison.Ordinal);
        Assert.Equal(0, result.Routes.Count(r => r.Feasible));
    }

    [Fact]
    public void A_delivery_whose_collection_is_unserved_is_reported()
    {
        var result = Evaluate(Line(20), [0, 1, 3]);

        Assert.Contains(result.Violations, v => v.Rule == RuleKind.Pair && v.Stop == "D" && v.Message.Contains("C is on no route", StringComparison.Ordinal));
        Assert.False(result.Feasible);
    }

    [Fact]
    public void Delivery_only_routes_keep_their_total_load_check()
    {
        // Without pickups the departure is the fullest point: 6 + 5 = 11 over 10 is 1 over (hand computation).
        var inst = TinyInstances.Line([TinyInstances.Stop("a", 1, 6), TinyInstances.Stop("b", 2, 5)], [TinyInstances.Vehicle("v", 10)], RuleSet.AllHard);

        var result = Evaluate(inst, [0, 1]);

        var v = Assert.Single(result.Violations);
        Assert.Equal(RuleKind.Capacity, v.Rule);
        Assert.Null(v.Stop);
        Assert.Equal(1, v.Amount, 9);
    }
}
