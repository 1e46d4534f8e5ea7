using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Screening;

public class StopScreenTests
{
    // Depot at the origin; stop i at (10 * (i + 1), 0); one time unit per km, so travel time = distance.
    private static Instance Build(Stop[] stops, Vehicle[] vehicles, RuleSet? rules = null, Units? units = null)
    {
        int n = stops.Length + 1;
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < stops.Length; i++)
        {
            x[i] = stops[i].X;
        }

        return new Instance("tiny", stops, [new Depot { Id = "hub", X = 0, Y = 0 }], vehicles, ["kg"], ["cold", "lift"],
            rules ?? RuleSet.AllHard, Objective.Cost, TravelTable.Planar(x, y, false), units ?? Units.Minutes);
    }

    private static Stop S(string id, double x, double kg = 1, ulong needs = 0, TimeWindow? window = null, double service = 0) => new()
    {
        Id = id, X = x, Y = 0, Demand = [kg], Needs = needs, ServiceTime = service, Windows = [window ?? TimeWindow.Always],
    };

    private static Vehicle V(string id, double kg, ulong equipment = 0, double start = 0, double end = 1440) => new()
    {
        Id = id, Capacity = [kg], Equipment = equipment, ShiftStart = start, ShiftEnd = end,
    };

    [Fact]
    public void Serviceable_stops_give_no_findings()
    {
        var inst = Build([S("a", 10), S("b", 20, kg: 5, needs: 1)], [V("v1", 10, equipment: 1)]);
        Assert.Empty(StopScreen.Screen(inst));
    }

    [Fact]
    public void Demand_above_every_capacity_names_dimension_and_largest()
    {
        var inst = Build([S("a", 10), S("big", 10, kg: 30)], [V("v1", 10), V("v2", 25)]);
        var f = Assert.Single(StopScreen.Screen(inst));
        Assert.Equal(1, f.StopIndex);
        Assert.Equal("big", f.StopId);
        Assert.Equal("capacity", f.Rule);
        Assert.Equal("stop big needs 30 kg; the largest vehicle carries 25 kg", f.Message);
    }

    [Fact]
    public void Needs_must_be_covered_by_one_vehicle()
    {
        // cold on one vehicle and lift on another: neither serves a stop that needs both.
        var inst = Build([S("both", 10, needs: 3)], [V("c", 10, equipment: 1), V("l", 10, equipment: 2)]);
        var f = Assert.Single(StopScreen.Screen(inst));
        Assert.Equal("stop both needs cold + lift; no single vehicle carries all of them", f.Message);
    }

    [Fact]
    public void Window_closing_before_earliest_arrival_is_reported_in_clock_time()
    {
        // Shift starts 08:00, 30 km at 1 min/km: earliest arrival 08:30 > close 08:20.
        var inst = Build([S("late", 30, window: new TimeWindow(480, 500))], [V("v", 10, start: 480)]);
        var f = Assert.Single(StopScreen.Screen(inst));
        Assert.Contains("08:30", f.Reason);
        Assert.Contains("08:20", f.Reason);

        var soft = inst.With(rules: RuleSet.AllHard with { TimeWindows = Rule.Soft(1) });
        Assert.Empty(StopScreen.Screen(soft));
    }

    [Fact]
    public void Service_that_cannot_end_before_the_shift_end_is_reported()
    {
        // 08:00 + 40 travel, window opens 09:00, 30 service, 40 back: earliest return 10:10 > shift end 10:00.
        var inst = Build([S("far", 40, window: new TimeWindow(540, 600), service: 30)], [V("v", 10, start: 480, end: 600)]);
        var f = Assert.Single(StopScreen.Screen(inst));
        Assert.Contains("10:10", f.Reason);
        Assert.Contains("10:00", f.Reason);
    }

    [Fact]
    public void Plain_numbers_when_the_time_unit_is_not_minutes()
    {
        var inst = Build([S("late", 30, window: new TimeWindow(0, 20))], [V("v", 10)], units: Units.Plain);
        var f = Assert.Single(StopScreen.Screen(inst));
        // The one reading of times (Units.Format): two decimals, as in routes.csv of a benchmark file.
        Assert.Contains("is 30.00,", f.Reason);
        Assert.Contains("at 20.00", f.Reason);
    }

    [Fact]
    public void Each_vehicle_failing_a_different_rule_is_explained()
    {
        // v1 is big but lacks the equipment; v2 has it but is too small.
        var inst = Build([S("x", 10, kg: 8, needs: 1)], [V("v1", 10), V("v2", 5, equipment: 1)]);
        var f = Assert.Single(StopScreen.Screen(inst));
        Assert.Equal("several", f.Rule);
        Assert.Contains("cannot be served by any single vehicle", f.Reason);
    }
}
