using Anneal.Core.Model;
using Anneal.Core.Travel;

namespace Anneal.Tests.Fixtures;

/// <summary>
/// Small random instances for property tests: windows, several dimensions, equipment, mixed rules; with
/// <c>pickups</c>, about half the stops also collect (returns that ride to the depot), with amounts up to twice a
/// delivery so that the fullest point is often in mid-route; with <c>pairs</c>, about a third of the stops are
/// linked two by two as collect-and-deliver pairs (the collection picks up what its delivery stop receives).
/// </summary>
internal static class RandomInstances
{
    public static Instance Create(Random rng, int stops, int vehicles, bool hardWindows, bool multiWindows = false, int dims = 1, bool heterogeneous = false, bool pickups = false, bool pairs = false)
    {
        var stopList = new List<Stop>();
        int locs = stops + 1;
        var x = new double[locs];
        var y = new double[locs];
        for (int i = 0; i < stops; i++)
        {
            x[i] = rng.Next(0, 100);
            y[i] = rng.Next(0, 100);
            double open = rng.Next(0, 300);
            double width = rng.Next(10, 150);
            var windows = new List<TimeWindow> { new(open, open + width) };
            if (multiWindows && rng.Next(3) == 0)
            {
                double o2 = open + width + rng.Next(5, 100);
                windows.Add(new TimeWindow(o2, o2 + rng.Next(10, 100)));
            }

            var demand = new double[dims];
            for (int d = 0; d < dims; d++)
            {
                demand[d] = rng.Next(1, 30);
            }

            var pickup = new double[pickups ? dims : 0];
            if (pickups && rng.Next(2) == 0)
            {
                for (int d = 0; d < dims; d++)
                {
                    pickup[d] = rng.Next(0, 60);
                }
            }

            stopList.Add(new Stop
            {
                Id = "s" + (i + 1),
                X = x[i],
                Y = y[i],
                Demand = demand,
                Pickup = pickup,
                ServiceTime = rng.Next(0, 15),
                Windows = windows.ToArray(),
                Needs = rng.Next(6) == 0 ? 1UL : 0UL,
                Optional = rng.Next(5) == 0,
                UnservedPenalty = rng.Next(2) == 0 ? rng.Next(50, 400) : double.NaN,
            });
        }

        if (multiWindows && stopList.TrueForAll(s => s.Windows.Length == 1))
        {
            // A third of the stops get a second window, so a short instance can draw none (12 stops: 0.8%); one is
            // given then, so that "several windows" always holds and the instance takes the scheduler's path.
            // No random draw here: every instance that already had one stays as it was.
            var last = stopList[^1];
            double o2 = last.Windows[0].Close + 30;
            stopList[^1] = last with { Windows = [last.Windows[0], new TimeWindow(o2, o2 + 60)] };
        }

        if (pairs)
        {
            LinkPairs(rng, stopList, dims);
        }

        x[stops] = 50;
        y[stops] = 50;
        var fleet = new List<Vehicle>();
        for (int v = 0; v < vehicles; v++)
        {
            var cap = new double[dims];
            for (int d = 0; d < dims; d++)
            {
                cap[d] = heterogeneous ? rng.Next(40, 120) : 80;
            }

            fleet.Add(new Vehicle
            {
                Id = "v" + (v + 1),
                Capacity = cap,
                ShiftStart = heterogeneous ? rng.Next(0, 60) : 0,
                ShiftEnd = rng.Next(350, 600),
                MaxDuration = rng.Next(3) == 0 ? rng.Next(200, 500) : double.PositiveInfinity,
                FixedCost = rng.Next(0, 100),
                CostPerDistance = rng.Next(1, 3),
                CostPerHour = rng.Next(0, 30),
                Equipment = v % 2 == 0 ? 1UL : 0UL,
            });
        }

        var rules = new RuleSet
        {
            TimeWindows = hardWindows ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            Capacity = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            ShiftEnd = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            MaxDuration = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(1, 5)),
            Unserved = rng.Next(2) == 0 ? Rule.HardRule : Rule.Soft(rng.Next(100, 300)),
        };
        var dimNames = Enumerable.Range(0, dims).Select(d => "d" + d).ToArray();
        var objective = (Objective)rng.Next(3);
        return new Instance("random", stopList, [new Depot { Id = "depot", X = 50, Y = 50 }], fleet, dimNames, ["cold"], rules, objective,
            TravelTable.Planar(x, y, roundToInteger: rng.Next(2) == 0), Units.Minutes);
    }

    private static void LinkPairs(Random rng, List<Stop> stopList, int dims)
    {
        var order = Enumerable.Range(0, stopList.Count).OrderBy(_ => rng.Next()).ToArray();
        int count = Math.Max(1, stopList.Count / 6);
        for (int k = 0; k < count; k++)
        {
            int c = order[2 * k], d = order[(2 * k) + 1];
            var amount = new double[dims];
            for (int j = 0; j < dims; j++)
            {
                amount[j] = rng.Next(1, 40);
            }

            // A pair is served by both ends or by neither, so both share the one's optional flag.
            bool optional = stopList[c].Optional;
            stopList[c] = stopList[c] with { Demand = new double[dims], Pickup = amount, Optional = optional };
            stopList[d] = stopList[d] with { Demand = (double[])amount.Clone(), Pickup = new double[dims], CollectFrom = c, Optional = optional };
        }
    }
}
