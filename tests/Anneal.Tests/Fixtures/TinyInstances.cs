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

    /// <summary>
    /// <see cref="Random"/> with pickups: two collect-and-deliver pairs (the collection picks up what its delivery
    /// receives; both ends share one optional flag) and returns at a third of the other stops, capacity hard.
    /// </summary>
    public static Instance WithPickups(int seed, int stops, int vehicles)
    {
        var rng = new Random(seed + 7000);
        var basis = Random(seed, stops, vehicles);
        var list = basis.Stops.ToList();
        for (int k = 0; k < 2; k++)
        {
            int c = 2 * k, d = (2 * k) + 1;
            double amount = rng.Next(5, 30);
            list[c] = list[c] with { Demand = [0], Pickup = [amount] };
            list[d] = list[d] with { Demand = [amount], Pickup = [0], CollectFrom = c, Optional = list[c].Optional };
        }

        for (int i = 4; i < list.Count; i++)
        {
            if (rng.Next(3) == 0)
            {
                list[i] = list[i] with { Pickup = [rng.Next(10, 40)] };
            }
        }

        return new Instance(basis.Name + "-pickups", list, basis.Depots, basis.Vehicles, basis.DimensionNames, basis.EquipmentNames,
            basis.Rules with { Capacity = Rule.HardRule }, basis.Objective, basis.Travel, basis.Units);
    }

    /// <summary>
    /// <see cref="Random"/> with two windows on most stops (a gap between them) and soft windows and shift ends,
    /// so plans are late and served in second windows. No per-hour cost: with several windows OR-Tools may leave
    /// later than Anneal's schedule, which changes only the route duration (see ScheduleApproximations).
    /// </summary>
    public static Instance SeveralWindows(int seed, int stops, int vehicles)
    {
        var rng = new Random(seed);
        var basis = Random(seed, stops, vehicles);
        var list = new List<Stop>();
        foreach (var s in basis.Stops)
        {
            double open = rng.Next(0, 150);
            double first = open + rng.Next(15, 40);
            double second = first + rng.Next(20, 90);
            var windows = rng.Next(4) == 0
                ? new[] { new TimeWindow(open, first) }
                : new[] { new TimeWindow(open, first), new TimeWindow(second, second + rng.Next(15, 40)) };
            list.Add(s with { Windows = windows });
        }

        var fleet = basis.Vehicles.Select(v => v with { CostPerHour = 0, ShiftEnd = 260, MaxDuration = double.PositiveInfinity }).ToList();
        var rules = new RuleSet
        {
            TimeWindows = Rule.Soft(1),
            Capacity = Rule.HardRule,
            ShiftEnd = Rule.Soft(2),
            MaxDuration = Rule.HardRule,
            Unserved = Rule.Soft(200),
        };
        var x = basis.Stops.Select(s => s.X).Append(30).ToArray();
        var y = basis.Stops.Select(s => s.Y).Append(30).ToArray();
        return new Instance("windows" + seed, list, basis.Depots, fleet, ["kg"], ["cold"], rules, Objective.Cost,
            TravelTable.Planar(x, y, roundToInteger: true), Units.Minutes);
    }

    /// <summary>
    /// A tightly packed job, every rule hard: 25 stops whose demands fill three vans to 243 of their 255 trays
    /// (a bin-packing start that OR-Tools' savings heuristic fails on), half of them with 90-minute windows.
    /// </summary>
    public static Instance Tight(int seed)
    {
        var rng = new Random(seed);
        int[] sizes = [5, 6, 7, 9, 11, 13, 14, 17];
        int[] demand;
        do
        {
            demand = Enumerable.Range(0, 25).Select(_ => sizes[rng.Next(sizes.Length)]).ToArray();
        }
        while (demand.Sum() != 243);

        var x = new double[26];
        var y = new double[26];
        var list = new List<Stop>();
        for (int i = 0; i < 25; i++)
        {
            x[i] = rng.Next(0, 21);
            y[i] = rng.Next(0, 16);
            int open = 60 * rng.Next(7, 14);
            list.Add(new Stop
            {
                Id = "t" + (i + 1),
                X = x[i],
                Y = y[i],
                Demand = [demand[i]],
                ServiceTime = 15,
                Windows = rng.Next(2) == 0 ? [TimeWindow.Always] : [new TimeWindow(open, open + 90)],
            });
        }

        x[25] = 10;
        y[25] = 7;
        var fleet = Enumerable.Range(1, 3).Select(v => new Vehicle
        {
            Id = "van-" + v,
            Capacity = [85],
            ShiftStart = 360,
            ShiftEnd = 960,
            FixedCost = 50,
            CostPerDistance = 0.4,
            CostPerHour = 20,
        }).ToList();
        return new Instance("tight" + seed, list, [new Depot { Id = "hub", X = 10, Y = 7 }], fleet, ["trays"], [], RuleSet.AllHard, Objective.Cost,
            TravelTable.Planar(x, y, roundToInteger: true), Units.Minutes);
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
