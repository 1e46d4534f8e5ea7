using Anneal.Core.DrivingRules;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Tests.Core.DrivingRules;

/// <summary>
/// Hand-computed schedules under driving rules. Every instance lies on a line from the depot at 0, and a leg takes as
/// many minutes as it is long, so each clock time below is a sum of leg lengths, waits and breaks worked by hand.
/// The limits are the eu-561 preset's (270 min of driving, then 45 min, or 15 then 30; 540 min a day; Regulation (EC)
/// No 561/2006 Art. 6 and 7, from memory) unless a test says otherwise.
/// </summary>
public class BreakSchedulerTests
{
    private static Stop At(string id, double x, double open = 0, double close = 1000) => TinyInstances.Stop(id, x, open: open, close: close);

    private static RouteEvaluation Route(DrivingRuleSet rules, params Stop[] stops)
    {
        var vehicle = TinyInstances.Vehicle("truck") with { ShiftStart = 0, ShiftEnd = 2000, DrivingRules = rules };
        var instance = TinyInstances.Line(stops, [vehicle], RuleSet.AllHard);
        var evaluation = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, Enumerable.Range(0, stops.Length).ToArray())]));
        return evaluation.Routes[0];
    }

    [Fact]
    public void One_break_goes_to_the_stop_where_the_drive_would_pass_270_minutes()
    {
        // depot -100-> a -100-> b -200-> depot: 200 min driven on reaching b, 400 with the leg home, so one break is
        // needed before the home leg passes 270. At b (arrival 200) it costs the same as on the road, and a stop is
        // preferred: break 200-245, leave b at 245, home at 245 + 200 = 445.
        var r = Route(DrivingPresets.Eu, At("a", 100), At("b", 200));

        var only = Assert.Single(r.Breaks);
        Assert.Equal(new PlannedBreak(200, 245, 1, BreakPlace.BeforeService, 100, false), only);
        Assert.Equal(200, r.Visits[1].Arrival, 6);
        Assert.Equal(245, r.Visits[1].Start, 6);
        Assert.Equal(0, r.Visits[1].Drive, 6);
        Assert.Equal(445, r.Metrics.Return, 6);
        Assert.Equal(45, r.Metrics.BreakMinutes, 6);
        Assert.Equal(400, r.Metrics.Driving, 6);
        Assert.True(r.Feasible);
    }

    [Fact]
    public void A_split_break_uses_two_waits_of_15_and_30_minutes_or_more()
    {
        // a (50, window closes at 50: no later start) -> b (100, opens 120: a 20 min wait, the first part) ->
        // c (250) -> d (265, opens 320: a 35 min wait, which completes the break) -> depot (265 min).
        // Driving 50+50+150+15 = 265 before d, then 265 home: without the split a full 45 min at d would return at 595;
        // with it the waits suffice and the truck is home at 320 + 265 = 585. Total driving 530 <= 540.
        var r = Route(DrivingPresets.Eu, At("a", 50, close: 50), At("b", 100, open: 120), At("c", 250), At("d", 265, open: 320));

        Assert.Equal(
            [new PlannedBreak(100, 120, 1, BreakPlace.Waiting, 50, true), new PlannedBreak(285, 320, 3, BreakPlace.Waiting, 15, false)],
            r.Breaks);
        Assert.Equal(585, r.Metrics.Return, 6);
        Assert.Equal(530, r.Metrics.Driving, 6);
        Assert.True(r.Feasible);
    }

    [Fact]
    public void Waiting_for_a_window_counts_as_the_break_when_it_is_long_enough()
    {
        // a (100, closes at 100) -> b (150, opens 200): 150 min driven, a 50 min wait at b, 150 home. The wait is the
        // break (>= 45), so no other stop is needed: home at 200 + 150 = 350.
        var r = Route(DrivingPresets.Eu, At("a", 100, close: 100), At("b", 150, open: 200));

        Assert.Equal(new PlannedBreak(150, 200, 1, BreakPlace.Waiting, 50, false), Assert.Single(r.Breaks));
        Assert.Equal(350, r.Metrics.Return, 6);
    }

    [Fact]
    public void A_leg_longer_than_the_limit_is_split_by_a_break_on_the_road()
    {
        // A rule set of the user's: 270 min, 45 min break, 600 min a day. depot -280-> a -280-> depot.
        // Out: 270 driven at 270, break 270-315, 10 more, a at 325. Home: 260 more reach 270 at 585, break 585-630,
        // 20 more, home at 650. Resting at a instead would return at 695.
        var rules = DrivingPresets.Eu with { Name = "long-day", Source = string.Empty, SplitFirst = 0, SplitSecond = 0, DailyDriving = 600 };
        var r = Route(rules, At("a", 280));

        Assert.Equal(
            [new PlannedBreak(270, 315, 0, BreakPlace.Road, 270, false), new PlannedBreak(585, 630, 1, BreakPlace.Road, 260, false)],
            r.Breaks);
        Assert.Equal(325, r.Visits[0].Arrival, 6);
        Assert.Equal(10, r.Visits[0].Drive, 6);
        Assert.Equal(650, r.Metrics.Return, 6);
        Assert.True(r.Feasible);
    }

    [Fact]
    public void A_route_that_cannot_be_legal_is_kept_and_reported_as_a_hard_breach()
    {
        // depot -300-> a -300-> depot: 600 min of driving, 60 over the 540 of Art. 6(1). The route is not shortened.
        var vehicle = TinyInstances.Vehicle("truck") with { ShiftStart = 0, ShiftEnd = 2000, DrivingRules = DrivingPresets.Eu };
        var instance = TinyInstances.Line([At("a", 300)], [vehicle], RuleSet.AllHard);
        var evaluation = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [0])]));

        Assert.False(evaluation.Feasible);
        Assert.Equal([0], evaluation.Routes[0].Stops);
        var breach = Assert.Single(evaluation.Violations);
        Assert.Equal(RuleKind.DrivingTime, breach.Rule);
        Assert.True(breach.Hard);
        Assert.Equal(60, breach.Amount, 6);
        Assert.Equal(60, evaluation.Routes[0].Metrics.DrivingBreach, 6);
    }

    [Fact]
    public void Soft_driving_rules_price_each_minute_over_and_keep_the_plan_feasible()
    {
        // The same 600 min day under soft rules at 2 per minute: 60 min over cost 120, and no hard rule is broken.
        var soft = DrivingPresets.Eu with { Rule = Rule.Soft(2) };
        var vehicle = TinyInstances.Vehicle("truck") with { ShiftStart = 0, ShiftEnd = 2000, DrivingRules = soft };
        var instance = TinyInstances.Line([At("a", 300)], [vehicle], RuleSet.AllHard);
        var evaluation = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [0])]));

        Assert.True(evaluation.Feasible);
        Assert.Equal(120, evaluation.Breakdown.DrivingOver, 6);
        Assert.False(Assert.Single(evaluation.Violations).Hard);
    }

    [Fact]
    public void A_vehicle_without_driving_rules_is_scheduled_as_before()
    {
        var r = Route(null!, At("a", 100), At("b", 200));

        Assert.Empty(r.Breaks);
        Assert.Equal(400, r.Metrics.Return, 6);
        Assert.Equal(100, r.Visits[1].Drive, 6);
    }
}
