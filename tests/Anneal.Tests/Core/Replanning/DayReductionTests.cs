using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Replanning;

namespace Anneal.Tests.Core.Replanning;

/// <summary>
/// The reduction of a started day, against hand-computed cases on a line: depot at 0, stops s10 … s40 at x = 10 … 40,
/// one minute per km, no service, windows always open. The given plan: vehicle A serves s10 (start 10) and s20
/// (start 20) and is back at 40; B serves s30 (start 30) and s40 (start 40) and is back at 80.
/// </summary>
public class DayReductionTests
{
    private static Instance Day(StabilityPrices? prices = null) => TinyInstances.Line(
        [TinyInstances.Stop("s10", 10), TinyInstances.Stop("s20", 20), TinyInstances.Stop("s30", 30), TinyInstances.Stop("s40", 40)],
        [TinyInstances.Vehicle("A"), TinyInstances.Vehicle("B")],
        RuleSet.AllHard with { Stability = prices ?? StabilityPrices.Default });

    private static GivenVisit Visit(int row, int stop, double start, VisitStatus? status = null, bool pinned = false) =>
        new(row, "s" + ((stop + 1) * 10), stop, start, start, status, pinned);

    private static GivenPlan Given() => new("plan.csv",
    [
        new GivenRoute(0, [Visit(3, 0, 10), Visit(4, 1, 20)], 0, 40),
        new GivenRoute(1, [Visit(7, 2, 30), Visit(8, 3, 40)], 0, 80),
    ]);

    [Fact]
    public void At_25_A_is_on_its_way_home_and_B_on_the_road_to_s30_which_is_fixed()
    {
        var day = DayReduction.Reduce(Day(), new ReplanRequest(Given(), 25, new HashSet<int>()));

        // A served s10 and s20 (starts 10 and 20 <= 25) and left s20 at 20: it is driving home, back at 40.
        Assert.Equal(["s10", "s20"], day.Fixed[0].Visits.Select(v => v.StopId));
        Assert.Equal(40, day.Fixed[0].ContinueAt);
        Assert.Equal(day.Day.DepotLocation(0), day.Fixed[0].ContinueLocation);

        // B left the depot at 0 < 25 towards s30 (start 30): s30 is fixed too, and B continues from s30 at 30.
        Assert.Equal(["s30"], day.Fixed[1].Visits.Select(v => v.StopId));
        Assert.Equal(30, day.Fixed[1].ContinueAt);
        Assert.Equal(2, day.Fixed[1].ContinueLocation);

        // Left to plan: s40 only, on B's rest of route; B's room is its whole capacity (the rest of a route starts loaded
        // with what it delivers, and s30 collected nothing) and its fixed cost is paid.
        Assert.Equal(["s40"], day.Instance.Stops.Select(s => s.Id));
        var b = day.Instance.Vehicles[day.ResidualVehicle(1)];
        Assert.Equal(100, b.Capacity[0]);
        Assert.Equal(30, b.ShiftStart);
        Assert.Equal(0, day.Instance.Vehicles[day.ResidualVehicle(0)].FixedCost);
        Assert.Equal([0], day.Start.Routes.Single().Stops);
        Assert.Equal(day.ResidualVehicle(1), day.Start.Routes[0].Vehicle);

        // B's rest: s30 -> s40 (10 km) -> depot (40 km), s40 starting at 30 + 10 = 40 as planned: no stability price.
        var evaluation = PlanEvaluator.Evaluate(day.Instance, day.Start);
        Assert.Equal(50, evaluation.Distance, 9);
        Assert.Equal(40, evaluation.Routes[0].Visits[0].Start, 9);
        Assert.Equal(0, evaluation.Breakdown.Stability);
    }

    [Fact]
    public void A_taken_out_vehicle_keeps_only_what_it_served_and_its_rest_goes_back_into_the_pool()
    {
        var day = DayReduction.Reduce(Day(), new ReplanRequest(Given(), 25, new HashSet<int> { 1 }));

        // B is taken out before starting s30 (start 30 > 25): no visit is fixed, s30 and s40 are unserved in the start.
        Assert.True(day.Fixed[1].TakenOut);
        Assert.Empty(day.Fixed[1].Visits);
        Assert.Equal(-1, day.ResidualVehicle(1));
        Assert.Equal(["s30", "s40"], day.Instance.Stops.Select(s => s.Id));
        Assert.Empty(day.Start.Routes);

        // Their planned vehicle is gone, so moving them carries no price; A starts again from the depot at 40.
        Assert.All(day.Instance.Stops, s => Assert.Equal(-1, s.PlannedVehicle));
        Assert.Equal(40, day.Instance.Vehicles.Single().ShiftStart);
    }

    [Fact]
    public void A_status_of_done_or_in_progress_fixes_a_visit_whatever_its_time_and_planned_leaves_it_to_the_time()
    {
        // At 5 nothing has started by its time (A's rows say planned); s30 is marked done and s40 in-progress although planned later.
        var plan = new GivenPlan("plan.csv",
        [
            new GivenRoute(0, [Visit(3, 0, 10, VisitStatus.Planned), Visit(4, 1, 20, VisitStatus.Planned)], null, null),
            new GivenRoute(1, [Visit(7, 2, 30, VisitStatus.Done), Visit(8, 3, 40, VisitStatus.InProgress)], null, null),
        ]);

        var day = DayReduction.Reduce(Day(), new ReplanRequest(plan, 5, new HashSet<int>()));

        Assert.Empty(day.Fixed[0].Visits);
        Assert.Equal(["s30", "s40"], day.Fixed[1].Visits.Select(v => v.StopId));
        Assert.Equal(["s10", "s20"], day.Instance.Stops.Select(s => s.Id));
    }

    [Fact]
    public void A_cancelled_stop_that_was_already_served_is_refused()
    {
        var plan = new GivenPlan("plan.csv", [new GivenRoute(0, [new GivenVisit(3, "gone", -1, 10, 10, null, false), Visit(4, 1, 20)], 0, 40)]);

        var e = Assert.Throws<ReplanException>(() => DayReduction.Reduce(Day(), new ReplanRequest(plan, 25, new HashSet<int>())));

        Assert.Equal(3, e.Problems.Single().Row);
        Assert.Equal("stop", e.Problems.Single().Column);
    }

    [Fact]
    public void A_pin_keeps_a_stop_on_its_vehicle_for_every_solver_as_equipment_only_that_vehicle_carries()
    {
        var plan = new GivenPlan("plan.csv", [new GivenRoute(1, [Visit(3, 3, 40, pinned: true)], null, null)]);

        var day = DayReduction.Reduce(Day(), new ReplanRequest(plan, null, new HashSet<int>()));

        var s40 = day.Instance.Stops.Single(s => s.Id == "s40");
        Assert.NotEqual(0UL, s40.Needs);
        Assert.Equal(s40.Needs, day.Instance.Vehicles[1].Equipment & s40.Needs);
        Assert.Equal(0UL, day.Instance.Vehicles[0].Equipment & s40.Needs);
        var onA = PlanEvaluator.Evaluate(day.Instance, new Plan([new PlannedRoute(0, [3])]));
        Assert.False(onA.Feasible);
    }

    [Fact]
    public void The_stability_price_counts_a_moved_stop_and_the_minutes_its_start_moves_beyond_the_tolerance()
    {
        // Prices 100 per move, 2 per minute beyond 5 minutes.
        var day = DayReduction.Reduce(Day(new StabilityPrices(100, 2, 5)), new ReplanRequest(Given(), null, new HashSet<int>()));

        // s40 moved from B to A, served after s20: A drives 10, 20, 40, so s40 starts at 40 as planned (no retime);
        // B serves s30 alone, start 30 as planned. Price: one move = 100.
        var moved = new Plan([new PlannedRoute(0, [0, 1, 3]), new PlannedRoute(1, [2])]);
        Assert.Equal(100, PlanEvaluator.Evaluate(day.Instance, moved).Breakdown.Stability, 9);

        // B serves s40 before s30: s40 starts at 40 (as planned), s30 at 50 (planned 30): 20 - 5 = 15 minutes beyond, 30.
        var swapped = new Plan([new PlannedRoute(0, [0, 1]), new PlannedRoute(1, [3, 2])]);
        Assert.Equal(30, PlanEvaluator.Evaluate(day.Instance, swapped).Breakdown.Stability, 9);
        Assert.Equal(0, PlanEvaluator.Evaluate(day.Instance, day.Start).Breakdown.Stability);
    }

    [Fact]
    public void Changes_list_new_cancelled_and_moved_stops_with_a_summary_line()
    {
        var given = new GivenPlan("plan.csv",
        [
            new GivenRoute(0, [Visit(3, 0, 10), Visit(4, 1, 20)], 0, 40),
            new GivenRoute(1, [Visit(7, 2, 30), new GivenVisit(8, "s99", -1, 35, 35, null, false)], 0, 80),
        ]);
        var day = DayReduction.Reduce(Day(), new ReplanRequest(given, 25, new HashSet<int>()));

        // Left: s40 (new: not in the given plan). Serve it with A from the depot at 40: start 80.
        var residual = new Plan([new PlannedRoute(day.ResidualVehicle(0), [day.ResidualStop(3)])]);
        var changes = DayChanges.Compute(day, PlanEvaluator.Evaluate(day.Instance, residual));

        Assert.Equal(
            new (string, ChangeReason, string?, string?)[] { ("s99", ChangeReason.Cancelled, "B", null), ("s40", ChangeReason.New, null, "A") },
            changes.Stops.Select(c => (c.Stop, c.Reason, c.OldVehicle, c.NewVehicle)));
        Assert.Equal(80, changes.Stops[1].NewStart);
        Assert.Equal("1 stop added, 1 cancelled, 0 moved to another van, 0 retimed by more than 15 min", changes.Summary("min"));
    }
}
