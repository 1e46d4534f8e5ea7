using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Screening;

/// <summary>
/// Whole-job screening on hand-made jobs: a depot at the origin, stops on the x axis, one minute per km. Every
/// expected figure is a hand sum of the job's numbers; the reason text is checked word for word.
/// </summary>
public class JobScreenTests
{
    private static Instance Build(Stop[] stops, Vehicle[] vehicles, RuleSet? rules = null)
    {
        int n = stops.Length + 1;
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < stops.Length; i++)
        {
            x[i] = stops[i].X;
        }

        return new Instance("day", stops, [new Depot { Id = "hub", X = 0, Y = 0 }], vehicles, ["kg"], ["cold"],
            rules ?? RuleSet.AllHard, Objective.Cost, TravelTable.Planar(x, y, false), Units.Minutes);
    }

    private static Stop S(string id, double x, double kg, ulong needs = 0, double service = 0, bool optional = false) => new()
    {
        Id = id, X = x, Y = 0, Demand = [kg], Needs = needs, ServiceTime = service, Optional = optional, Windows = [TimeWindow.Always],
    };

    private static Vehicle V(string id, double kg, ulong equipment = 0, double end = 1440, double maxDuration = double.PositiveInfinity) => new()
    {
        Id = id, Capacity = [kg], Equipment = equipment, ShiftStart = 0, ShiftEnd = end, MaxDuration = maxDuration,
    };

    [Fact]
    public void A_day_that_fits_the_fleet_gives_no_obstacle()
    {
        var day = Build([S("a", 10, 30), S("b", 20, 30, needs: 1)], [V("v1", 40), V("v2", 40, equipment: 1)]);
        Assert.Empty(JobScreen.Screen(day));
    }

    [Fact]
    public void The_days_demand_above_the_fleets_capacity_is_named_in_units()
    {
        // 3 × 30 kg = 90 kg against 2 × 40 kg = 80 kg; each stop alone fits a vehicle.
        var day = Build([S("a", 10, 30), S("b", 20, 30), S("c", 30, 30)], [V("v1", 40), V("v2", 40)]);
        var o = Assert.Single(JobScreen.Screen(day));
        Assert.Equal(new Obstacle("capacity", null, "the day's 90 kg exceed the fleet's 80 kg"), o);
    }

    [Fact]
    public void Optional_stops_do_not_count_against_the_fleet()
    {
        // Mandatory 50 + 50 = 100 kg against 80 kg; the optional 70 kg is not counted.
        var day = Build([S("a", 10, 50), S("b", 20, 50), S("c", 30, 70, optional: true)], [V("v1", 80)]);
        var o = Assert.Single(JobScreen.Screen(day));
        Assert.Equal("the 2 stops that must be served take 100 kg, more than the fleet's 80 kg", o.Message);

        var fits = Build([S("a", 10, 40), S("b", 20, 40), S("c", 30, 70, optional: true)], [V("v1", 80)]);
        Assert.Empty(JobScreen.Screen(fits));
    }

    [Fact]
    public void Soft_capacity_lets_the_fleet_carry_more_at_a_price()
    {
        var day = Build([S("a", 10, 30), S("b", 20, 30), S("c", 30, 30)], [V("v1", 40), V("v2", 40)], RuleSet.AllHard with { Capacity = Rule.Soft(1) });
        Assert.Empty(JobScreen.Screen(day));
    }

    [Fact]
    public void Stops_needing_equipment_must_fit_the_vehicles_that_carry_it()
    {
        // 30 + 30 kg need cold; only v2 (40 kg) carries it, though the fleet as a whole (140 kg) has room.
        var day = Build([S("a", 10, 30, needs: 1), S("b", 20, 30, needs: 1)], [V("v1", 100), V("v2", 40, equipment: 1)]);
        var o = Assert.Single(JobScreen.Screen(day));
        Assert.Equal(new Obstacle("capacity", null, "the 2 stops needing cold take 60 kg; the one vehicle carrying it holds 40 kg"), o);
    }

    [Fact]
    public void Service_and_the_least_driving_must_fit_the_summed_shifts()
    {
        // Stops 10 km apart, 60 min service each: at least 3 × 60 + 3 × 10 = 210 min = 3.5 h; one shift of 120 min = 2 h.
        // Each stop alone fits (the farthest: 30 + 60 + 30 = 120 min).
        var day = Build([S("a", 10, 1, service: 60), S("b", 20, 1, service: 60), S("c", 30, 1, service: 60)], [V("v1", 10, end: 120)]);
        var o = Assert.Single(JobScreen.Screen(day));
        Assert.Equal(new Obstacle("shift-end", null, "the stops that must be served need at least 3.5 h of service and driving; the fleet's shifts give 2 h"), o);

        var soft = day.With(rules: RuleSet.AllHard with { ShiftEnd = Rule.Soft(1) });
        Assert.Empty(JobScreen.Screen(soft));
    }

    [Fact]
    public void A_maximum_duration_shorter_than_a_stops_out_and_back_is_named()
    {
        // 30 km out, 10 min service, 30 km back: 70 min, more than the 60 min allowed.
        var day = Build([S("far", 30, 1, service: 10)], [V("v", 10, maxDuration: 60)]);
        var o = Assert.Single(JobScreen.Screen(day));
        Assert.Equal("max-duration", o.Rule);
        Assert.Equal("far", o.Stop);
        Assert.Equal("stop far is too far for the maximum duration: there and back with its service takes 70 min, the longest route vehicle v may drive is 60 min", o.Message);
    }

    [Fact]
    public void A_stop_too_big_for_every_vehicle_reads_as_the_coordinator_would_say_it()
    {
        var day = Build([S("C15", 10, 900), S("a", 20, 10)], [V("v1", 400), V("v2", 300)]);
        var found = JobScreen.Screen(day);
        Assert.Contains(new Obstacle("capacity", "C15", "stop C15 needs 900 kg; the largest vehicle carries 400 kg"), found);
        Assert.Contains(new Obstacle("capacity", null, "the day's 910 kg exceed the fleet's 700 kg"), found);
    }
}
