using System.Numerics;
using Anneal.Core.DrivingRules;
using Anneal.Core.Model;

namespace Anneal.Core.Evaluation;

/// <summary>
/// The exact forward pass over one route: the truth every faster evaluation is tested against.
/// <para>
/// Service starts at max(arrival, open) of the first window still open on arrival. Past the last window a soft
/// window makes the truck late (service starts on arrival, later stops are delayed too); a hard window is relaxed
/// by time warp (service starts at the close, the warp is the violation, later stops are not delayed).
/// </para>
/// <para>
/// The vehicle leaves at the start of its shift, then departure is delayed by the most it can without making any
/// stop later or moving the return (forward time slack, Savelsbergh 1985), so waiting is not paid as driver time.
/// </para>
/// </summary>
public static class RouteScheduler
{
    public static RouteMetrics Measure(Instance instance, int vehicle, ReadOnlySpan<int> stops) =>
        Schedule(instance, vehicle, stops, Span<VisitTimes>.Empty);

    /// <summary>Measures the route; when <paramref name="visits"/> is not empty, also writes each stop's times.</summary>
    public static RouteMetrics Schedule(Instance instance, int vehicle, ReadOnlySpan<int> stops, Span<VisitTimes> visits) =>
        Schedule(instance, vehicle, stops, visits, null);

    /// <summary>
    /// As <see cref="Schedule(Instance, int, ReadOnlySpan{int}, Span{VisitTimes})"/>; a vehicle with driving rules has its
    /// breaks planned (<see cref="BreakScheduler"/>), and written to <paramref name="breaks"/> when given.
    /// </summary>
    public static RouteMetrics Schedule(Instance instance, int vehicle, ReadOnlySpan<int> stops, Span<VisitTimes> visits, List<PlannedBreak>? breaks)
    {
        var m = default(RouteMetrics);
        m.StopCount = stops.Length;
        if (stops.Length == 0)
        {
            return m;
        }

        var v = instance.Vehicles[vehicle];
        var travel = instance.Travel;
        int home = instance.DepotLocation(v.StartDepot);
        int end = instance.DepotLocation(v.EndDepot);

        // The stability price needs every start; the search asks for none, so they go to a scratch of this thread.
        bool stability = instance.Costs.PricesStability;
        if (stability && visits.IsEmpty)
        {
            visits = Scratch(stops.Length);
        }

        // The times written come from a second pass from the delayed departure, which serves every stop in the window
        // the first pass chose: the slack allows exactly that, and its rounding (an arrival 3e-14 past a close) must
        // not move a stop to a later window, which would make the times disagree with the measures.
        Span<int> windows = visits.IsEmpty ? Span<int>.Empty : stops.Length <= 256 ? stackalloc int[stops.Length] : new int[stops.Length];
        double departureDelay = Forward(instance, v, stops, v.ShiftStart, ref m, Span<VisitTimes>.Empty, windows, follow: false);
        double departure = v.ShiftStart + departureDelay;

        if (v.DrivingRules is not null)
        {
            BreakScheduler.Schedule(instance, vehicle, stops, departure, ref m, visits, breaks);
        }
        else
        {
            if (!visits.IsEmpty)
            {
                var check = default(RouteMetrics);
                Forward(instance, v, stops, departure, ref check, visits, windows, follow: true);
            }

            m.Departure = departure;
            double warp = instance.Rules.TimeWindows.Hard ? m.TimeWindowViolation : 0;
            m.Duration = m.Return - departure + warp;
            m.Overtime = Math.Max(0, m.Return - v.ShiftEnd);
            m.DurationExcess = Math.Max(0, m.Duration - v.MaxDuration);
        }

        double overload = RouteLoads.Overload(instance, vehicle, stops);
        m.Overload = overload;

        ulong needed = 0;
        for (int k = 0; k < stops.Length; k++)
        {
            needed |= instance.Stops[stops[k]].Needs;
        }

        m.MissingEquipment = BitOperations.PopCount(needed & ~v.Equipment);
        m.PairBreaks = RouteLoads.PairBreaks(instance, stops);

        double distance = travel.Distance(home, stops[0]);
        for (int k = 1; k < stops.Length; k++)
        {
            distance += travel.Distance(stops[k - 1], stops[k]);
        }

        m.Distance = distance + travel.Distance(stops[^1], end);
        if (stability)
        {
            double price = 0;
            for (int k = 0; k < stops.Length; k++)
            {
                price += CostModel.StopStability(instance, stops[k], vehicle, visits[k].Start);
            }

            m.Stability = price;
        }

        return m;
    }

    [ThreadStatic]
    private static VisitTimes[]? _scratch;

    private static Span<VisitTimes> Scratch(int length)
    {
        if (_scratch is null || _scratch.Length < length)
        {
            _scratch = new VisitTimes[Math.Max(length, 2 * (_scratch?.Length ?? 32))];
        }

        return _scratch.AsSpan(0, length);
    }

    /// <summary>
    /// One pass from <paramref name="departure"/>; fills violation and return time, and returns the forward slack.
    /// Records each stop's window in <paramref name="windows"/> when it is not empty, or serves each stop in the
    /// recorded one when <paramref name="follow"/> is set.
    /// </summary>
    private static double Forward(Instance instance, Vehicle v, ReadOnlySpan<int> stops, double departure, ref RouteMetrics m, Span<VisitTimes> visits, Span<int> windows, bool follow)
    {
        var travel = instance.Travel;
        bool hard = instance.Rules.TimeWindows.Hard;
        int prev = instance.DepotLocation(v.StartDepot);
        double t = departure;
        double cumulativeWait = 0;
        double slack = v.ShiftEnd - departure;
        double violation = 0;
        for (int k = 0; k < stops.Length; k++)
        {
            int s = stops[k];
            double arrival = t + travel.Duration(prev, s);
            int first = instance.WindowOffset[s];
            int last = instance.WindowOffset[s + 1] - 1;
            int w = first;
            if (follow)
            {
                w = windows[k];
            }
            else
            {
                while (w <= last && instance.WindowClose[w] < arrival)
                {
                    w++;
                }

                if (!windows.IsEmpty)
                {
                    windows[k] = w;
                }
            }

            double start;
            double late = 0;
            double wait = 0;
            if (w <= last)
            {
                start = Math.Max(arrival, instance.WindowOpen[w]);
                wait = start - arrival;
                cumulativeWait += wait;
                slack = Math.Min(slack, cumulativeWait + (instance.WindowClose[w] - start));
            }
            else
            {
                double close = instance.WindowClose[last];
                late = arrival - close;
                start = hard ? close : arrival;
                slack = Math.Min(slack, cumulativeWait);
            }

            violation += late;
            double leave = start + instance.Service[s];
            if (!visits.IsEmpty)
            {
                visits[k] = new VisitTimes { Arrival = arrival, Wait = wait, Start = start, Departure = leave, Late = late, Drive = travel.Duration(prev, s) };
            }

            t = leave;
            prev = s;
        }

        m.Return = t + travel.Duration(prev, instance.DepotLocation(v.EndDepot));
        m.TimeWindowViolation = violation;
        return Math.Max(0, Math.Min(slack, cumulativeWait));
    }
}
