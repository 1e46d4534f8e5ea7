using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Core.Screening;

/// <summary>
/// Finds stops that no vehicle can serve even on a route of its own, before any search: such a stop would make
/// every plan infeasible, so the user should hear why at once. A route with one stop is the easiest way to serve
/// it, so a stop that fails here fails in every plan. O(stops × vehicles).
/// </summary>
public static class StopScreen
{
    private static readonly int CheckCount = Enum.GetValues<ScreenCheck>().Length;

    public static IReadOnlyList<ScreenFinding> Screen(Instance instance)
    {
        var findings = new List<ScreenFinding>();
        var failures = new int[CheckCount];
        for (int s = 0; s < instance.StopCount; s++)
        {
            Array.Clear(failures);
            bool served = false;
            for (int v = 0; v < instance.Vehicles.Count && !served; v++)
            {
                int failed = 0;
                for (int c = 0; c < CheckCount; c++)
                {
                    if (Fails(instance, s, v, (ScreenCheck)c))
                    {
                        failures[c]++;
                        failed++;
                    }
                }

                served = failed == 0;
            }

            if (!served)
            {
                findings.Add(new ScreenFinding(s, instance.Stops[s].Id, Explain(instance, s, failures)));
            }
        }

        return findings;
    }

    private static bool Fails(Instance instance, int s, int v, ScreenCheck check)
    {
        var vehicle = instance.Vehicles[v];
        var rules = instance.Rules;
        switch (check)
        {
            case ScreenCheck.Capacity:
                if (!rules.Capacity.Hard)
                {
                    return false;
                }

                for (int d = 0; d < instance.DimensionCount; d++)
                {
                    if (instance.Demand(s, d) > instance.Capacity(v, d))
                    {
                        return true;
                    }
                }

                return false;
            case ScreenCheck.Equipment:
                return (instance.Stops[s].Needs & ~vehicle.Equipment) != 0;
            case ScreenCheck.Window:
                return rules.TimeWindows.Hard && EarliestArrival(instance, s, v) > instance.Hull(s).Close;
            case ScreenCheck.ShiftEnd:
                return rules.ShiftEnd.Hard && EarliestReturn(instance, s, v) > vehicle.ShiftEnd;
            default:
                return rules.MaxDuration.Hard && ShortestRoute(instance, s, v) > vehicle.MaxDuration;
        }
    }

    private static double EarliestArrival(Instance instance, int s, int v)
    {
        var vehicle = instance.Vehicles[v];
        return vehicle.ShiftStart + instance.Travel.Duration(instance.DepotLocation(vehicle.StartDepot), s);
    }

    /// <summary>Leave at shift start, start service in the first window still open (or on arrival past them all), go home.</summary>
    private static double EarliestReturn(Instance instance, int s, int v)
    {
        double arrival = EarliestArrival(instance, s, v);
        double start = arrival;
        foreach (var w in instance.Stops[s].Windows)
        {
            if (w.Close >= arrival)
            {
                start = Math.Max(arrival, w.Open);
                break;
            }
        }

        if (start == arrival && instance.Rules.TimeWindows.Hard && arrival > instance.Hull(s).Close)
        {
            start = instance.Hull(s).Close; // a hard window is checked on its own; do not count it twice here
        }

        var vehicle = instance.Vehicles[v];
        return start + instance.ServiceTime(s) + instance.Travel.Duration(s, instance.DepotLocation(vehicle.EndDepot));
    }

    /// <summary>Waiting can be avoided by leaving later, so the shortest route is travel there, service, travel back.</summary>
    private static double ShortestRoute(Instance instance, int s, int v)
    {
        var vehicle = instance.Vehicles[v];
        return instance.Travel.Duration(instance.DepotLocation(vehicle.StartDepot), s) + instance.ServiceTime(s)
            + instance.Travel.Duration(s, instance.DepotLocation(vehicle.EndDepot));
    }

    private static string Explain(Instance instance, int s, int[] failures)
    {
        int fleet = instance.Vehicles.Count;
        if (fleet == 0)
        {
            return "there are no vehicles";
        }

        var reasons = new List<string>();
        for (int c = 0; c < CheckCount; c++)
        {
            if (failures[c] == fleet)
            {
                reasons.Add(Reason(instance, s, (ScreenCheck)c));
            }
        }

        if (reasons.Count == 0)
        {
            var parts = new List<string>();
            for (int c = 0; c < CheckCount; c++)
            {
                if (failures[c] > 0)
                {
                    parts.Add($"{failures[c]} of {fleet} fail {Label((ScreenCheck)c)}");
                }
            }

            reasons.Add("no single vehicle meets every requirement at once (" + string.Join(", ", parts) + ")");
        }

        return string.Join("; ", reasons);
    }

    private static string Label(ScreenCheck check) => check switch
    {
        ScreenCheck.Capacity => "capacity",
        ScreenCheck.Equipment => "equipment",
        ScreenCheck.Window => "the time window",
        ScreenCheck.ShiftEnd => "the shift end",
        _ => "the maximum duration",
    };

    private static string Reason(Instance instance, int s, ScreenCheck check)
    {
        var units = instance.Units;
        string Clock(double t) => double.IsPositiveInfinity(t) ? "never" : units.Format(t);
        switch (check)
        {
            case ScreenCheck.Capacity:
                return CapacityReason(instance, s);
            case ScreenCheck.Equipment:
                return $"needs {EquipmentList(instance, instance.Stops[s].Needs)} and no single vehicle offers all of them";
            case ScreenCheck.Window:
                double arrival = Best(instance, v => EarliestArrival(instance, s, v), out _);
                return $"the earliest any vehicle can arrive is {Clock(arrival)}, after its last window closes at {Clock(instance.Hull(s).Close)}";
            case ScreenCheck.ShiftEnd:
                Best(instance, v => EarliestReturn(instance, s, v) - instance.Vehicles[v].ShiftEnd, out int bv);
                return $"service cannot end in time to return to the end depot by the shift end: vehicle {instance.Vehicles[bv].Id} would be back at the earliest at "
                    + $"{Clock(EarliestReturn(instance, s, bv))}, its shift ends at {Clock(instance.Vehicles[bv].ShiftEnd)}";
            default:
                Best(instance, v => ShortestRoute(instance, s, v) - instance.Vehicles[v].MaxDuration, out int dv);
                string suffix = units.TimeSuffix;
                return $"a route serving only this stop takes {Number(ShortestRoute(instance, s, dv))}{suffix}, more than the maximum duration "
                    + $"{Number(instance.Vehicles[dv].MaxDuration)}{suffix} of vehicle {instance.Vehicles[dv].Id}";
        }
    }

    private static string CapacityReason(Instance instance, int s)
    {
        var parts = new List<string>();
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            double largest = Best(instance, v => -instance.Capacity(v, d), out _);
            if (instance.Demand(s, d) > -largest)
            {
                parts.Add($"demand {Number(instance.Demand(s, d))} {DimensionName(instance, d)} is above every vehicle's capacity (largest {Number(-largest)})");
            }
        }

        return parts.Count > 0
            ? string.Join("; ", parts)
            : "no single vehicle has room for all of its demand at once (each falls short in some dimension)";
    }

    /// <summary>The smallest value of <paramref name="f"/> over the fleet, and the vehicle giving it.</summary>
    private static double Best(Instance instance, Func<int, double> f, out int vehicle)
    {
        double best = double.PositiveInfinity;
        vehicle = 0;
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            double x = f(v);
            if (x < best)
            {
                best = x;
                vehicle = v;
            }
        }

        return best;
    }

    private static string EquipmentList(Instance instance, ulong bits)
    {
        var names = new List<string>();
        for (int i = 0; i < 64; i++)
        {
            if ((bits & (1UL << i)) != 0)
            {
                names.Add(i < instance.EquipmentNames.Count ? instance.EquipmentNames[i] : "#" + i.ToString(CultureInfo.InvariantCulture));
            }
        }

        return string.Join(" + ", names);
    }

    private static string DimensionName(Instance instance, int d) =>
        d < instance.DimensionNames.Count ? instance.DimensionNames[d] : "units";

    private static string Number(double x) => x.ToString("0.##", CultureInfo.InvariantCulture);
}
