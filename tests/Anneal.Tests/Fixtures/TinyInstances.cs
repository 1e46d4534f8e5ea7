using Anneal.Core.Model;
using Anneal.Core.Travel;

namespace Anneal.Tests.Fixtures;

/// <summary>
/// Seeded small instances for the OR-Tools tests: integer coordinates with rounded distances, integer times and
/// prices, so the integer scaling is exact and only the models can disagree. Single windows, and lateness priced
/// above driver time, keep them clear of the schedule approximation the solvers report.
/// </summary>
internal static class TinyInstances
{
    public static Instance Random(int seed, int stops, int vehicles)
    {
        var rng = new Random(seed);
        var x = new double[stops + 1];
        var y = new double[stops + 1];
        var list = new List<Stop>();
        for (int i = 0; i < stops; i++)
        {
            x[i] = rng.Next(0, 60);
            y[i] = rng.Next(0, 60);
            double open = rng.Next(0, 200);
            list.Add(new Stop
            {
                Id = "s" + (i + 1),
                X = x[i],
                Y = y[i],
                Demand = [rng.Next(1, 20)],
                ServiceTime = rng.Next(0, 10),
                Windows = [new TimeWindow(open, open + rng.Next(30, 150))],
                Needs = rng.Next(5) == 0 ? 1UL : 0UL,
                Optional = rng.Next(4) == 0,
                UnservedPenalty = rng.Next(2) == 0 ? rng.Next(50, 300) : double.NaN,
            });
        }

        x[stops] = 30;
        y[stops] = 30;
        var fleet = new List<Vehicle>();
        double shiftEnd = rng.Next(400, 600);
        double maxDuration = rng.Next(2) == 0 ? rng.Next(250, 400) : double.PositiveInfinity;
        for (int v = 0; v < vehicles; v++)
        {
            bool second = v % 2 == 1;
            fleet.Add(new Vehicle
            {
                Id = "v" + (v + 1),
                Capacity = [second ? 45 : 70],
                ShiftEnd = shiftEnd,
                MaxDuration = maxDuration,
                FixedCost = second ? 20 : 60,
                CostPerDistance = second ? 2 : 1,
                CostPerHour = second ? 30 : 12,
                Equipment = second ? 0UL : 1UL,
            });
        }

        var rules = new RuleSet
        {
            TimeWindows = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(2, 6)),
            Capacity = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            ShiftEnd = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            MaxDuration = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(1),
            Unserved = rng.Next(3) == 0 ? Rule.Soft(200) : Rule.HardRule,
        };
        return new Instance("tiny" + seed, list, [new Depot { Id = "depot", X = 30, Y = 30 }], fleet, ["kg"], ["cold"], rules,
            (Objective)rng.Next(3), TravelTable.Planar(x, y, roundToInteger: true), Units.Minutes);
    }

    /// <summary>A hand-made instance: stops at the given points (depot at the origin), one-dimensional demand.</summary>
    public static Instance Line(Stop[] stops, Vehicle[] vehicles, RuleSet rules, Objective objective = Objective.Distance)
    {
        var x = stops.Select(s => s.X).Append(0).ToArray();
        var y = stops.Select(s => s.Y).Append(0).ToArray();
        return new Instance("line", stops, [new Depot { Id = "depot", X = 0, Y = 0 }], vehicles, ["kg"], ["cold"], rules, objective,
            TravelTable.Planar(x, y, roundToInteger: true), Units.Minutes);
    }

    public static Stop Stop(string id, double x, double demand = 1, double open = 0, double close = 1000, bool optional = false, double penalty = double.NaN, ulong needs = 0) => new()
    {
        Id = id,
        X = x,
        Y = 0,
        Demand = [demand],
        Windows = [new TimeWindow(open, close)],
        Optional = optional,
        UnservedPenalty = penalty,
        Needs = needs,
    };

    public static Vehicle Vehicle(string id, double capacity = 100, double shiftEnd = double.PositiveInfinity, double maxDuration = double.PositiveInfinity, double fixedCost = 0, ulong equipment = 0) => new()
    {
        Id = id,
        Capacity = [capacity],
        ShiftEnd = shiftEnd,
        MaxDuration = maxDuration,
        FixedCost = fixedCost,
        CostPerDistance = 1,
        Equipment = equipment,
    };
}
