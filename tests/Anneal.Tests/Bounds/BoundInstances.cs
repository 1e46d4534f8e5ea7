using Anneal.Core.Model;
using Anneal.Core.Travel;

namespace Anneal.Tests.Bounds;

/// <summary>
/// Seeded small instances for the bound tests, rougher than the OR-Tools ones on purpose: real-valued coordinates
/// (double-precision distances), up to three windows per stop, two demand dimensions, optional stops, equipment,
/// and each rule hard or soft at random.
/// </summary>
internal static class BoundInstances
{
    public static Instance Random(int seed, int stops, int vehicles)
    {
        var rng = new Random(seed);
        var x = new double[stops + 1];
        var y = new double[stops + 1];
        var list = new List<Stop>();
        for (int i = 0; i < stops; i++)
        {
            x[i] = rng.NextDouble() * 50;
            y[i] = rng.NextDouble() * 50;
            var windows = new List<TimeWindow>();
            double t = rng.NextDouble() * 100;
            int count = rng.Next(1, 4);
            for (int w = 0; w < count; w++)
            {
                double close = t + 20 + (rng.NextDouble() * 80);
                windows.Add(new TimeWindow(t, close));
                t = close + 10 + (rng.NextDouble() * 60);
            }

            list.Add(new Stop
            {
                Id = "s" + (i + 1),
                X = x[i],
                Y = y[i],
                Demand = [rng.Next(1, 20) + rng.NextDouble(), rng.Next(0, 4)],
                ServiceTime = rng.NextDouble() * 10,
                Windows = windows.ToArray(),
                Needs = rng.Next(6) == 0 ? 1UL : 0UL,
                Optional = rng.Next(4) == 0,
                UnservedPenalty = rng.Next(2) == 0 ? 30 + (rng.NextDouble() * 200) : double.NaN,
            });
        }

        x[stops] = 25;
        y[stops] = 25;
        var fleet = new List<Vehicle>();
        double shiftEnd = 300 + (rng.NextDouble() * 200);
        for (int v = 0; v < vehicles; v++)
        {
            bool second = v % 2 == 1;
            fleet.Add(new Vehicle
            {
                Id = "v" + (v + 1),
                Capacity = [second ? 35 : 55, second ? 5 : 8],
                ShiftEnd = shiftEnd,
                MaxDuration = rng.Next(3) == 0 ? 150 + (rng.NextDouble() * 100) : double.PositiveInfinity,
                FixedCost = second ? 25 : 50,
                CostPerDistance = second ? 1.5 : 1,
                CostPerHour = second ? 30 : 12,
                Equipment = second ? 0UL : 1UL,
            });
        }

        var rules = new RuleSet
        {
            TimeWindows = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(1 + (rng.NextDouble() * 4)),
            Capacity = rng.Next(3) == 0 ? Rule.Soft(1 + (rng.NextDouble() * 4)) : Rule.HardRule,
            ShiftEnd = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(2),
            MaxDuration = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(1),
            Unserved = rng.Next(3) == 0 ? Rule.Soft(150) : Rule.HardRule,
        };
        return new Instance("bounds" + seed, list, [new Depot { Id = "depot", X = 25, Y = 25 }], fleet, ["kg", "crates"], ["cold"], rules,
            (Objective)rng.Next(3), TravelTable.Planar(x, y, roundToInteger: false), Units.Minutes);
    }
}
