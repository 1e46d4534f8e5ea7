using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Screening;

/// <summary>The screening of pairs: hand-made cases where no plan can serve the pair (by hand: the times and loads in the comments).</summary>
public class PairScreenTests
{
    private static Instance Pair(double collectOpen, double deliverClose, double amount)
    {
        Stop S(string id, double x, double demand, double pickup, double open, double close, int from = -1) => new()
        {
            Id = id, X = x, Y = 0, Demand = [demand], Pickup = [pickup], CollectFrom = from, ServiceTime = 5, Windows = [new TimeWindow(open, close)],
        };
        var stops = new[] { S("mill", 10, 0, amount, collectOpen, 1000), S("shop", 30, amount, 0, 0, deliverClose, from: 0) };
        return new Instance("pair", stops, [new Depot { Id = "hub", X = 0, Y = 0 }], [TinyInstances.Vehicle("van", 50)], ["kg"], [], RuleSet.AllHard,
            Objective.Distance, TravelTable.Planar([10, 30, 0], [0, 0, 0], roundToInteger: true), Units.Minutes);
    }

    [Fact]
    public void A_delivery_that_closes_before_the_goods_can_arrive_is_reported()
    {
        // Collected at 100 at the earliest, 5 min service, 20 min to the shop: 125, after its close at 120.
        var found = JobScreen.Screen(Pair(collectOpen: 100, deliverClose: 120, amount: 10));

        var o = Assert.Single(found);
        Assert.Equal("pair", o.Rule);
        Assert.Equal("shop", o.Stop);
        Assert.Contains("mill>shop", o.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_collection_larger_than_every_vehicle_is_reported()
    {
        var found = JobScreen.Screen(Pair(collectOpen: 0, deliverClose: 1000, amount: 60));

        Assert.Contains(found, o => o.Rule == "capacity" && o.Stop == "mill" && o.Message.Contains("hands over 60", StringComparison.Ordinal));
    }

    [Fact]
    public void A_pair_that_can_be_served_is_not_reported()
    {
        // 0 + 5 + 20 = 25, well before 1000; 10 kg fit 50 (the pair's delivery is not loaded at the depot).
        Assert.Empty(JobScreen.Screen(Pair(collectOpen: 0, deliverClose: 1000, amount: 10)));
    }
}
