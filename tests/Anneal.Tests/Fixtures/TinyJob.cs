using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input;

namespace Anneal.Tests.Fixtures;

/// <summary>
/// A minute-based job built in code (no reader needed): depot at (0,0), stops on 3-4-5 triangles so distances are
/// whole kilometres, 40 km/h so one km takes 1.5 minutes. Stop A (3,4) is 5 km out, B (6,8) 5 km beyond A.
/// </summary>
internal static class TinyJob
{
    public static Instance Create(RuleSet? rules = null, bool optional = false, double capacityKg = 100)
    {
        var stops = new List<Stop>
        {
            Stop("A", 3, 4, 30, 10, optional, new TimeWindow(540, 600)),
            Stop("B", 6, 8, 40, 5, optional, new TimeWindow(480, 500), new TimeWindow(600, 660)),
            Stop("C", 0, 5, 20, 5, optional, TimeWindow.Always),
        };
        var depots = new List<Depot> { new() { Id = "D", X = 0, Y = 0 } };
        var vehicles = new List<Vehicle>
        {
            new() { Id = "van-1", Capacity = [capacityKg, 10], ShiftStart = 480, ShiftEnd = 960, FixedCost = 50, CostPerDistance = 0.5, CostPerHour = 20 },
            new() { Id = "van-2", Capacity = [capacityKg, 10], ShiftStart = 480, ShiftEnd = 960, FixedCost = 50, CostPerDistance = 0.5, CostPerHour = 20 },
        };
        double[] x = [3, 6, 0, 0];
        double[] y = [4, 8, 5, 0];
        var travel = TravelTable.Planar(x, y, roundToInteger: false, timePerDistance: 60.0 / 40.0);
        return new Instance("tiny job", stops, depots, vehicles, ["kg", "crates"], [], rules ?? RuleSet.AllHard, Objective.Cost, travel, Units.Minutes);
    }

    public static LoadedInput Loaded(Instance instance) => new(instance, new JobSettings(), "csv-job", "tiny");

    private static Stop Stop(string id, double x, double y, double kg, double service, bool optional, params TimeWindow[] windows) => new()
    {
        Id = id,
        X = x,
        Y = y,
        Demand = [kg, 1],
        ServiceTime = service,
        Windows = windows,
        Optional = optional,
    };
}
