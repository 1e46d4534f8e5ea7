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
                var (rule, reason) = Explain(instance, s, failures);
                findings.Add(new ScreenFinding(s, instance.Stops[s].Id, rule, reason));
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

    /// <summary>The rule every vehicle fails (several joined by "; "), or, when each fails a different one, how many fail which.</summary>
    private static (string Rule, string Reason) Explain(Instance instance, int s, int[] failures)
    {
        int fleet = instance.Vehicles.Count;
        if (fleet == 0)
        {
            return ("fleet", "cannot be served: there are no vehicles");
        }

        var rules = new List<string>();
        var reasons = new List<string>();
        for (int c = 0; c < CheckCount; c++)
        {
            if (failures[c] == fleet)
            {
                rules.Add(RuleName((ScreenCheck)c));
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

            return ("several", "cannot be served by any single vehicle: each falls short somewhere (" + string.Join(", ", parts) + ")");
        }

        return (rules.Count == 1 ? rules[0] : "several", string.Join("; and it ", reasons));
    }

    private static string Label(ScreenCheck check) => check switch
    {
        ScreenCheck.Capacity => "capacity",
        ScreenCheck.Equipment => "equipment",
        ScreenCheck.Window => "the time window",
        ScreenCheck.ShiftEnd => "the shift end",
        _ => "the maximum duration",
    };

    /// <summary>The rule's name as violations and summary.json spell it.</summary>
    private static string RuleName(ScreenCheck check) => check switch
    {
        ScreenCheck.Capacity => "capacity",
        ScreenCheck.Equipment => "equipment",
        ScreenCheck.Window => "time-window",
        ScreenCheck.ShiftEnd => "shift-end",
        _ => "max-duration",
    };

    /// <summary>Why every vehicle fails this check, as words that follow "stop X ".</summary>
    private static string Reason(Instance instance, int s, ScreenCheck check)
    {
        var units = instance.Units;
        string Clock(double t) => double.IsPositiveInfinity(t) ? "never" : units.Format(t);
        switch (check)
        {
            case ScreenCheck.Capacity:
                return CapacityReason(instance, s);
            case ScreenCheck.Equipment:
                return EquipmentReason(instance, instance.Stops[s].Needs);
            case ScreenCheck.Window:
                double arrival = Best(instance, v => EarliestArrival(instance, s, v), out _);
                return $"cannot be reached in time: the earliest any vehicle can arrive is {Clock(arrival)}, after its last window closes at {Clock(instance.Hull(s).Close)}";
            case ScreenCheck.ShiftEnd:
                Best(instance, v => EarliestReturn(instance, s, v) - instance.Vehicles[v].ShiftEnd, out int bv);
                return $"cannot be served and left in time to be back by the shift end: vehicle {instance.Vehicles[bv].Id} would be back at "
                    + $"{Clock(EarliestReturn(instance, s, bv))} at the earliest, its shift ends at {Clock(instance.Vehicles[bv].ShiftEnd)}";
            default:
                Best(instance, v => ShortestRoute(instance, s, v) - instance.Vehicles[v].MaxDuration, out int dv);
                string suffix = units.TimeSuffix;
                return $"is too far for the maximum duration: there and back with its service takes {Number(ShortestRoute(instance, s, dv))}{suffix}, "
                    + $"the longest route vehicle {instance.Vehicles[dv].Id} may drive is {Number(instance.Vehicles[dv].MaxDuration)}{suffix}";
        }
    }

    private static string CapacityReason(Instance instance, int s)
    {
        var parts = new List<string>();
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            double largest = -Best(instance, v => -instance.Capacity(v, d), out _);
            if (instance.Demand(s, d) > largest)
            {
                string name = DimensionName(instance, d);
                parts.Add($"needs {Number(instance.Demand(s, d))} {name}; the largest vehicle carries {Number(largest)} {name}");
            }
        }

        return parts.Count > 0
            ? string.Join("; it ", parts)
            : "does not fit any single vehicle: each is too small in some dimension";
    }

    /// <summary>Names the items no vehicle carries at all; else says no one vehicle carries the whole set.</summary>
    private static string EquipmentReason(Instance instance, ulong needs)
    {
        ulong offered = 0;
        foreach (var v in instance.Vehicles)
        {
            offered |= v.Equipment;
        }

        ulong missing = needs & ~offered;
        return missing != 0
            ? $"needs {EquipmentList(instance, missing)}; no vehicle carries {(System.Numerics.BitOperations.PopCount(missing) == 1 ? "it" : "them")}"
            : $"needs {EquipmentList(instance, needs)}; no single vehicle carries all of them";
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

    internal static string EquipmentList(Instance instance, ulong bits)
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

    internal static string DimensionName(Instance instance, int d) =>
        d < instance.DimensionNames.Count ? instance.DimensionNames[d] : "units";

    internal static string Number(double x) => x.ToString("#,0.##", CultureInfo.InvariantCulture);
}
