using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Evaluation;

/// <summary>
/// Soft lateness versus hard time warp on a hand-worked route (semantics as in GUIDE.md "Time windows, exactly":
/// a soft window is real lateness that delays later stops; a hard window is relaxed by time warp, after
/// Nagata, Bräysy &amp; Dullaert 2010 and Vidal et al. 2013, which does not delay them).
/// </summary>
public class WindowSemanticsTests
{
    // Depot at (0,0); stops on the y axis, so every leg is 10 long and travel time equals distance.
    //   a (0,10) window [0, 5]   service 2
    //   b (0,20) window [0, 20]  service 3
    //   c (0,30) window [40, 50] service 1
    // Route depot -> a -> b -> c -> depot: distance 10 + 10 + 10 + 30 = 60. Shift [0, 1000].
    private static Instance Build(RuleSet rules)
    {
        Stop S(string id, double y, double open, double close, double service) => new()
        {
            Id = id, X = 0, Y = y, Demand = [1], ServiceTime = service, Windows = [new TimeWindow(open, close)],
        };

        var stops = new[] { S("a", 10, 0, 5, 2), S("b", 20, 0, 20, 3), S("c", 30, 40, 50, 1) };
        var travel = TravelTable.Planar([0, 0, 0, 0], [10, 20, 30, 0], roundToInteger: false);
        var vehicle = new Vehicle { Id = "v1", Capacity = [10], ShiftStart = 0, ShiftEnd = 1000 };
        return new Instance("hand", stops, [new Depot { Id = "D", X = 0, Y = 0 }], [vehicle], ["demand"], [],
            rules, Objective.Distance, travel);
    }

    private static readonly Plan Route = new([new PlannedRoute(0, [0, 1, 2])]);

    [Fact]
    public void Soft_windows_are_real_lateness_that_delays_later_stops()
    {
        // Leave the depot at 0 (a is already late, so there is no slack to delay the start).
        //   a: arrive 10, window closed at 5 -> 5 late, start 10, leave 12
        //   b: arrive 22, window closed at 20 -> 2 late (only because a was late), start 22, leave 25
        //   c: arrive 35, wait 5, start 40, leave 41
        //   depot: back at 41 + 30 = 71. Lateness 5 + 2 = 7 at price 1; objective 60 + 7 = 67; duration 71.
        var inst = Build(new RuleSet { TimeWindows = Rule.Soft(1) });
        var r = PlanEvaluator.Evaluate(inst, Route);
        var v = r.Routes[0].Visits;

        Assert.Equal([10.0, 22, 35], v.Select(x => x.Arrival));
        Assert.Equal([10.0, 22, 40], v.Select(x => x.Start));
        Assert.Equal([12.0, 25, 41], v.Select(x => x.Departure));
        Assert.Equal([5.0, 2, 0], v.Select(x => x.Late));
        Assert.Equal(71, r.Routes[0].Metrics.Return, 9);
        Assert.Equal(71, r.Duration, 9);
        Assert.Equal(7, r.Breakdown.Lateness, 9);
        Assert.Equal(67, r.Objective, 9);
        Assert.True(r.Feasible);
        Assert.Equal(["a", "b"], r.Violations.Select(x => x.Stop));
        Assert.All(r.Violations, x => Assert.Equal((RuleKind.TimeWindow, false), (x.Rule, x.Hard)));
    }

    [Fact]
    public void Hard_windows_show_time_warp_that_does_not_delay_later_stops()
    {
        //   a: arrive 10, warp 5 back to the close, start 5, leave 7
        //   b: arrive 17, on time, start 17, leave 20
        //   c: arrive 30, wait 10, start 40, leave 41
        //   depot: back at 71. Time warp 5 (a only); duration 71 + 5 = 76 (warp counted, Vidal et al. 2013).
        var inst = Build(RuleSet.AllHard);
        var r = PlanEvaluator.Evaluate(inst, Route);
        var v = r.Routes[0].Visits;

        Assert.Equal([10.0, 17, 30], v.Select(x => x.Arrival));
        Assert.Equal([5.0, 17, 40], v.Select(x => x.Start));
        Assert.Equal([7.0, 20, 41], v.Select(x => x.Departure));
        Assert.Equal([5.0, 0, 0], v.Select(x => x.Late));
        Assert.Equal(5, r.Routes[0].Metrics.TimeWindowViolation, 9);
        Assert.Equal(76, r.Duration, 9);
        Assert.Equal(60, r.Objective, 9);
        Assert.False(r.Feasible);
        var only = Assert.Single(r.Violations);
        Assert.Equal((RuleKind.TimeWindow, true, "a"), (only.Rule, only.Hard, only.Stop));
    }

    [Fact]
    public void Waiting_at_the_first_stop_delays_the_departure_instead()
    {
        // Route depot -> c alone: arrive 30 if leaving at 0, window opens at 40, so the vehicle leaves at 10
        // (forward time slack, Savelsbergh 1985): arrive 40, start 40, leave 41, back 71, duration 61.
        var inst = Build(RuleSet.AllHard);
        var r = PlanEvaluator.Evaluate(inst, new Plan([new PlannedRoute(0, [2])]));
        Assert.Equal(10, r.Routes[0].Metrics.Departure, 9);
        Assert.Equal(40, r.Routes[0].Visits[0].Arrival, 9);
        Assert.Equal(61, r.Duration, 9);
    }
}
