using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Core.Screening;

/// <summary>
/// Finds, before any search, why a job cannot be served in full: the whole day against the whole fleet (demand per
/// dimension against the summed capacity, also within each group of stops needing one item of equipment, and the
/// least service and driving time against the summed shifts), then every stop no vehicle can serve on a route of its
/// own (<see cref="StopScreen"/>). Each check is a relaxation (one route per vehicle, every stop reached from its
/// nearest place), so what it reports holds for every plan; an empty list proves nothing.
/// </summary>
public static class JobScreen
{
    /// <summary>Above this many stops the time check counts service only: the nearest-place scan is quadratic.</summary>
    public const int NearestScanLimit = 2000;

    public static IReadOnlyList<Obstacle> Screen(Instance instance)
    {
        var found = new List<Obstacle>();
        if (instance.Vehicles.Count > 0)
        {
            Capacity(instance, found);
            Time(instance, found);
        }

        foreach (var f in StopScreen.Screen(instance))
        {
            found.Add(new Obstacle(f.Rule, f.StopId, f.Message));
        }

        PairScreen.Screen(instance, found);

        return found;
    }

    /// <summary>Each vehicle drives one route, so the stops that must be served cannot take more than the fleet carries.</summary>
    private static void Capacity(Instance instance, List<Obstacle> found)
    {
        if (!instance.Rules.Capacity.Hard)
        {
            return;
        }

        bool anyOptional = false;
        foreach (var stop in instance.Stops)
        {
            anyOptional |= stop.Optional;
        }

        for (int d = 0; d < instance.DimensionCount; d++)
        {
            var (demand, stops) = Demand(instance, d, 0);
            double capacity = Capacity(instance, d, 0, out _);
            if (demand > capacity + Tolerance(capacity))
            {
                string unit = StopScreen.DimensionName(instance, d);
                found.Add(new Obstacle("capacity", null, anyOptional
                    ? $"the {stops} stops that must be served take {N(demand)} {unit}, more than the fleet's {N(capacity)} {unit}"
                    : $"the day's {N(demand)} {unit} exceed the fleet's {N(capacity)} {unit}"));
            }
        }

        for (int e = 0; e < instance.EquipmentNames.Count && e < 64; e++)
        {
            ulong bit = 1UL << e;
            for (int d = 0; d < instance.DimensionCount; d++)
            {
                var (demand, stops) = Demand(instance, d, bit);
                double capacity = Capacity(instance, d, bit, out int carriers);
                if (stops > 0 && carriers > 0 && carriers < instance.Vehicles.Count && demand > capacity + Tolerance(capacity))
                {
                    string unit = StopScreen.DimensionName(instance, d);
                    string item = instance.EquipmentNames[e];
                    string carry = carriers == 1 ? $"the one vehicle carrying it holds {N(capacity)} {unit}" : $"the {carriers} vehicles carrying it hold {N(capacity)} {unit}";
                    found.Add(new Obstacle("capacity", null,
                        $"the {(stops == 1 ? "stop" : $"{stops} stops")} needing {item} take {N(demand)} {unit}; {carry}"));
                }
            }
        }
    }

    /// <summary>Every stop must be reached from somewhere and served, within shifts that cannot stretch when their end is hard.</summary>
    private static void Time(Instance instance, List<Obstacle> found)
    {
        var rules = instance.Rules;
        double available = 0;
        bool byShift = false, byDuration = false;
        foreach (var v in instance.Vehicles)
        {
            double shift = rules.ShiftEnd.Hard ? v.ShiftEnd - v.ShiftStart : double.PositiveInfinity;
            double longest = rules.MaxDuration.Hard ? v.MaxDuration : double.PositiveInfinity;
            byShift |= double.IsFinite(shift) && shift <= longest;
            byDuration |= double.IsFinite(longest) && longest < shift;
            available += Math.Max(0, Math.Min(shift, longest));
        }

        if (!double.IsFinite(available))
        {
            return;
        }

        bool withTravel = instance.StopCount <= NearestScanLimit;
        double needed = 0;
        for (int s = 0; s < instance.StopCount; s++)
        {
            if (!instance.Stops[s].Optional)
            {
                needed += instance.ServiceTime(s) + (withTravel ? NearestArrival(instance, s) : 0);
            }
        }

        if (needed > available + Tolerance(available))
        {
            string what = withTravel ? "service and driving" : "service";
            string limits = byShift ? (byDuration ? "shifts and maximum durations" : "shifts") : "maximum durations";
            found.Add(new Obstacle(byShift ? "shift-end" : "max-duration", null,
                $"the stops that must be served need at least {Hours(instance, needed)} of {what}; the fleet's {limits} give {Hours(instance, available)}"));
        }
    }

    /// <summary>
    /// Summed demand in dimension <paramref name="d"/> of the stops that must be served and need every item in
    /// <paramref name="needs"/>: what leaves the depot (a pair's delivery is loaded on the way, so it does not count).
    /// </summary>
    private static (double Demand, int Stops) Demand(Instance instance, int d, ulong needs)
    {
        double total = 0;
        int count = 0;
        for (int s = 0; s < instance.StopCount; s++)
        {
            var stop = instance.Stops[s];
            if (!stop.Optional && (stop.Needs & needs) == needs)
            {
                total += instance.DepotLoad(s, d);
                count++;
            }
        }

        return (total, count);
    }

    private static double Capacity(Instance instance, int d, ulong equipment, out int carriers)
    {
        double total = 0;
        carriers = 0;
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            if ((instance.Vehicles[v].Equipment & equipment) == equipment)
            {
                total += instance.Capacity(v, d);
                carriers++;
            }
        }

        return total;
    }

    /// <summary>The shortest drive into stop <paramref name="s"/> from any other stop or depot.</summary>
    private static double NearestArrival(Instance instance, int s)
    {
        double best = double.PositiveInfinity;
        int locations = instance.StopCount + instance.Depots.Count;
        for (int j = 0; j < locations; j++)
        {
            if (j != s)
            {
                best = Math.Min(best, instance.Travel.Duration(j, s));
            }
        }

        return double.IsFinite(best) ? best : 0;
    }

    private static double Tolerance(double x) => 1e-9 * Math.Max(1, Math.Abs(x));

    private static string Hours(Instance instance, double time) =>
        instance.Units.Clock
            ? (time / 60).ToString("#,0.#", CultureInfo.InvariantCulture) + " h"
            : N(time) + " time units";

    private static string N(double x) => StopScreen.Number(x);
}
