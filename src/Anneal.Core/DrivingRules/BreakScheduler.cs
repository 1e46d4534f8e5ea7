using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Core.DrivingRules;

/// <summary>
/// The exact schedule of a route whose driver works under a <see cref="DrivingRuleSet"/>: where the breaks go, and the
/// clock times, driving and breaches that follow. Part of the truth (<see cref="RouteScheduler"/> calls it for every
/// vehicle with rules), so the move evaluator measures such routes through it too.
/// <para>
/// The method is a labelling pass over the stops, in the spirit of the break scheduling of Goel (2009, "Vehicle
/// scheduling and routing with drivers' working hours", Transportation Science 43(1)) — cited from memory, the paper was
/// not at hand. A label is one way to have reached a stop: its clock, the driving since the last full break, whether
/// the first part of a split break is taken, and the lateness so far. At each stop a label goes on in up to five ways:
/// no break; a full (or completing) break on arrival, before service; the first part of a split break on arrival; a
/// break after service; a wait long enough for a full break taken as only a split break's first part. Whatever the
/// choice, a break is forced on the road the moment the next minute of driving would pass the limit (a leg split in
/// two), and a wait for a window counts as a break, or as its first part, when it is long enough and the rule set says
/// waiting counts. A label that can drive the rest of the route within the limit goes on without a break only. A label that is no earlier, has driven no less since its break, has no
/// more of a split break behind it and is no less late than another is dropped (it cannot end better: waiting is always
/// allowed and any break it could take, the other can take too). Voluntary breaks on the road are not tried: one is never
/// better than the same break at the next stop before service. The set kept per stop is bounded
/// (<see cref="MaxLabels"/>); the brute-force tests check on small routes that no feasible placement is missed.
/// </para>
/// <para>
/// The driving-before-break limit can always be kept (a break on the road is always possible), so what can be broken is
/// the day's driving (fixed by the stops) and the duty span (breaks included), besides the usual rules.
/// </para>
/// </summary>
public static class BreakScheduler
{
    /// <summary>Labels kept per stop.</summary>
    public const int MaxLabels = 12;

    private const double Eps = 1e-9;

    private const byte NoBreak = 0, BreakBefore = 1, PartBefore = 2, BreakAfter = 3, WaitAsPart = 4;

    private static ReadOnlySpan<byte> Order => [NoBreak, PartBefore, BreakBefore, BreakAfter, WaitAsPart];

    private struct Label
    {
        public double T;
        public double Drive;
        public double Late;
        public double Breaks;
        public double RowDrive;
        public bool Part;
        public short Count;
        public short Road;
        public int Parent;
        public byte Choice;
    }

    private sealed class Arena
    {
        public Label[] Labels = new Label[256];
        public int[] LayerStart = new int[64];
        public byte[] Choices = new byte[64];

        /// <summary>Per leg k (to stop k; the last one home): its driving, and the driving from its start to the end of the route.</summary>
        public double[] Legs = new double[64];
        public double[] Rest = new double[65];
    }

    [ThreadStatic]
    private static Arena? t_arena;

    /// <summary>The rule set's limits in the instance's time unit.</summary>
    private readonly struct Limits
    {
        public readonly double Drive, Full, First, Second, Daily, Span;
        public readonly bool Split, Waiting;

        public Limits(DrivingRuleSet r, Units units)
        {
            double k = units.TimePerHour / 60.0;
            Drive = r.DrivingBeforeBreak * k;
            Full = r.BreakMinutes * k;
            First = r.SplitFirst * k;
            Second = r.SplitSecond * k;
            Daily = r.DailyDriving * k;
            Span = r.DutySpan * k;
            Split = r.MaySplit;
            Waiting = r.WaitingCounts;
        }
    }

    /// <summary>The result of one labelling pass from a departure time.</summary>
    private struct Outcome
    {
        public double Return, Late, Breaks, Key;
        public int Best, Count, Road;
    }

    /// <summary>
    /// Schedules the route with breaks and fills the time measures of <paramref name="m"/> (departure, return, duration,
    /// violation, overtime, duration excess, driving, breaks, driving breaches); the caller fills the rest. Tries leaving at
    /// the shift start and at <paramref name="delayed"/> (the departure the plain pass chose) and keeps the better.
    /// </summary>
    internal static void Schedule(Instance instance, int vehicle, ReadOnlySpan<int> stops, double delayed, ref RouteMetrics m,
        Span<VisitTimes> visits, List<PlannedBreak>? breaks)
    {
        var v = instance.Vehicles[vehicle];
        var rules = v.DrivingRules!;
        var lim = new Limits(rules, instance.Units);
        var arena = t_arena ??= new Arena();
        Ensure(arena, stops.Length);
        double driving = Legs(instance, v, stops, arena);

        double departure = v.ShiftStart;
        var best = Pass(instance, v, stops, departure, lim, arena);
        if (delayed > departure + Eps)
        {
            var later = Pass(instance, v, stops, delayed, lim, arena);
            if (later.Key < best.Key - Eps || (later.Key <= best.Key + Eps && later.Return - delayed < best.Return - departure - Eps))
            {
                best = later;
                departure = delayed;
            }
        }

        if (!visits.IsEmpty || breaks is not null)
        {
            // The arena holds the last pass; run the chosen one again and replay its choices with recording.
            best = Pass(instance, v, stops, departure, lim, arena);
            Replay(instance, v, stops, departure, lim, arena, best.Best, visits, breaks);
        }

        bool hard = instance.Rules.TimeWindows.Hard;
        m.Departure = departure;
        m.Return = best.Return;
        m.TimeWindowViolation = best.Late;
        m.BreakMinutes = best.Breaks;
        m.Driving = driving;
        double span = best.Return - departure;
        m.Duration = span + (hard ? best.Late : 0);
        m.Overtime = Math.Max(0, best.Return - v.ShiftEnd);
        m.DurationExcess = Math.Max(0, m.Duration - v.MaxDuration);
        double over = Math.Max(0, driving - lim.Daily) + Math.Max(0, span - lim.Span);
        if (rules.Rule.Hard)
        {
            m.DrivingBreach = over;
        }
        else
        {
            m.DrivingOver = over;
        }
    }

    /// <summary>The day's driving over <paramref name="rules"/>'s limit, and the duty span's, in the instance's time unit.</summary>
    public static (double Driving, double Span) Excess(Instance instance, DrivingRuleSet rules, in RouteMetrics m)
    {
        var lim = new Limits(rules, instance.Units);
        return (Math.Max(0, m.Driving - lim.Daily), Math.Max(0, m.Return - m.Departure - lim.Span));
    }

    /// <summary>Fills the legs' driving and what remains from each; returns the day's driving.</summary>
    private static double Legs(Instance instance, Vehicle v, ReadOnlySpan<int> stops, Arena arena)
    {
        var travel = instance.Travel;
        var legs = arena.Legs;
        var rest = arena.Rest;
        int n = stops.Length;
        legs[0] = travel.Duration(instance.DepotLocation(v.StartDepot), stops[0]);
        for (int k = 1; k < n; k++)
        {
            legs[k] = travel.Duration(stops[k - 1], stops[k]);
        }

        legs[n] = travel.Duration(stops[^1], instance.DepotLocation(v.EndDepot));
        rest[n + 1] = 0;
        for (int k = n; k >= 0; k--)
        {
            rest[k] = rest[k + 1] + legs[k];
        }

        return rest[0];
    }

    private static void Ensure(Arena arena, int n)
    {
        int labels = ((n + 1) * MaxLabels) + 1;
        if (arena.Labels.Length < labels)
        {
            arena.Labels = new Label[labels * 2];
        }

        if (arena.LayerStart.Length < n + 2)
        {
            arena.LayerStart = new int[(n + 2) * 2];
            arena.Choices = new byte[(n + 2) * 2];
            arena.Legs = new double[(n + 2) * 2];
            arena.Rest = new double[(n + 2) * 2];
        }
    }

    private static Outcome Pass(Instance instance, Vehicle v, ReadOnlySpan<int> stops, double departure, in Limits lim, Arena arena)
    {
        var labels = arena.Labels;
        var layer = arena.LayerStart;
        var legs = arena.Legs;
        var rest = arena.Rest;
        labels[0] = new Label { T = departure, Parent = -1 };
        layer[0] = 0;
        layer[1] = 1;
        for (int k = 0; k < stops.Length; k++)
        {
            int from = layer[k], to = layer[k + 1];
            int count = 0;
            for (int i = from; i < to; i++)
            {
                // A label that can drive the rest of the route within the limit needs no break: any would only delay it.
                int choices = labels[i].Drive + rest[k] <= lim.Drive + Eps ? 1 : Order.Length;
                for (int c = 0; c < choices; c++)
                {
                    byte choice = Order[c];
                    var next = labels[i];
                    next.Parent = i;
                    next.Choice = choice;
                    if (Step(instance, ref next, legs[k], stops[k], k, choice, lim, Span<VisitTimes>.Empty, null))
                    {
                        count = Insert(labels, to, count, in next);
                    }
                }
            }

            layer[k + 2] = to + count;
        }

        // The leg home closes every label; the best is the least late and over, then the earliest back.
        double tail = legs[stops.Length];
        var outcome = new Outcome { Key = double.PositiveInfinity, Return = double.PositiveInfinity };
        bool hard = instance.Rules.TimeWindows.Hard;
        for (int i = layer[stops.Length]; i < layer[stops.Length + 1]; i++)
        {
            var end = labels[i];
            DriveLeg(ref end, tail, stops.Length, lim, null);
            double span = end.T - departure;
            double key = end.Late + Math.Max(0, end.T - v.ShiftEnd) + Math.Max(0, span - lim.Span)
                + Math.Max(0, span + (hard ? end.Late : 0) - v.MaxDuration);
            // Of equal schedules the one with fewer breaks, then fewer on the road, is kept: a driver rests at a stop.
            bool better = key < outcome.Key - Eps
                || (key <= outcome.Key + Eps && (end.T < outcome.Return - Eps
                    || (end.T <= outcome.Return + Eps && (end.Count < outcome.Count || (end.Count == outcome.Count && end.Road < outcome.Road)))));
            if (better)
            {
                outcome = new Outcome { Return = end.T, Late = end.Late, Breaks = end.Breaks, Key = key, Best = i, Count = end.Count, Road = end.Road };
            }
        }

        return outcome;
    }

    /// <summary>Adds a label to the layer starting at <paramref name="start"/> unless one there dominates it; drops those it dominates.</summary>
    private static int Insert(Label[] labels, int start, int count, in Label next)
    {
        for (int i = start; i < start + count; i++)
        {
            if (Dominates(in labels[i], in next))
            {
                return count;
            }
        }

        int kept = start;
        for (int i = start; i < start + count; i++)
        {
            if (!Dominates(in next, in labels[i]))
            {
                labels[kept++] = labels[i];
            }
        }

        count = kept - start;
        if (count < MaxLabels)
        {
            labels[start + count] = next;
            return count + 1;
        }

        // Full: the new label replaces the latest of the least punctual, when it is better than that one.
        int worst = start;
        for (int i = start + 1; i < start + count; i++)
        {
            if (labels[i].Late > labels[worst].Late + Eps || (labels[i].Late >= labels[worst].Late - Eps && labels[i].T > labels[worst].T))
            {
                worst = i;
            }
        }

        if (next.Late < labels[worst].Late - Eps || (next.Late <= labels[worst].Late + Eps && next.T < labels[worst].T))
        {
            labels[worst] = next;
        }

        return count;
    }

    /// <summary>No later, no more driving since the break, no less of a split break, no later for windows; of equals, fewer breaks.</summary>
    private static bool Dominates(in Label a, in Label b)
    {
        if (!(a.T <= b.T + Eps && a.Drive <= b.Drive + Eps && (a.Part || !b.Part) && a.Late <= b.Late + Eps))
        {
            return false;
        }

        bool equal = a.T >= b.T - Eps && a.Drive >= b.Drive - Eps && a.Part == b.Part && a.Late >= b.Late - Eps;
        return !equal || a.Count < b.Count || (a.Count == b.Count && a.Road <= b.Road);
    }

    private static void Replay(Instance instance, Vehicle v, ReadOnlySpan<int> stops, double departure, in Limits lim, Arena arena, int best,
        Span<VisitTimes> visits, List<PlannedBreak>? breaks)
    {
        var labels = arena.Labels;
        var choices = arena.Choices;
        for (int k = stops.Length - 1, i = best; k >= 0; k--, i = labels[i].Parent)
        {
            choices[k] = labels[i].Choice;
        }

        var state = new Label { T = departure };
        for (int k = 0; k < stops.Length; k++)
        {
            Step(instance, ref state, arena.Legs[k], stops[k], k, choices[k], lim, visits, breaks);
        }

        DriveLeg(ref state, arena.Legs[stops.Length], stops.Length, lim, breaks);
    }

    /// <summary>Drives a leg, taking a break on the road whenever the next minute would pass the limit.</summary>
    private static void DriveLeg(ref Label st, double leg, int position, in Limits lim, List<PlannedBreak>? breaks)
    {
        double rest = leg;
        while (st.Drive + rest > lim.Drive + Eps)
        {
            double x = Math.Max(0, lim.Drive - st.Drive);
            st.T += x;
            rest -= x;
            st.RowDrive += x;
            double need = st.Part ? lim.Second : lim.Full;
            breaks?.Add(new PlannedBreak(st.T, st.T + need, position, BreakPlace.Road, st.RowDrive, false));
            st.RowDrive = 0;
            st.Count++;
            st.Road++;
            st.T += need;
            st.Breaks += need;
            st.Drive = 0;
            st.Part = false;
        }

        st.T += rest;
        st.Drive += rest;
        st.RowDrive += rest;
    }

    /// <summary>One stop under one choice; false when the choice makes no sense there (no driving since the last break).</summary>
    private static bool Step(Instance instance, ref Label st, double leg, int s, int k, byte choice, in Limits lim,
        Span<VisitTimes> visits, List<PlannedBreak>? breaks)
    {
        DriveLeg(ref st, leg, k, lim, breaks);
        if ((choice == BreakBefore && !(st.Drive > Eps || st.Part)) || (choice == PartBefore && (!lim.Split || st.Part || st.Drive <= Eps)))
        {
            return false;
        }

        double arrival = st.T;
        double ready = arrival;
        if (choice == BreakBefore)
        {
            double need = st.Part ? lim.Second : lim.Full;
            Take(ref st, ready, need, k, BreakPlace.BeforeService, false, breaks);
            ready += need;
        }
        else if (choice == PartBefore)
        {
            Take(ref st, ready, lim.First, k, BreakPlace.BeforeService, true, breaks);
            ready += lim.First;
        }

        int w = instance.WindowOffset[s];
        int last = instance.WindowOffset[s + 1] - 1;
        while (w <= last && instance.WindowClose[w] < ready)
        {
            w++;
        }

        double start, late = 0, wait = 0;
        if (w <= last)
        {
            start = Math.Max(ready, instance.WindowOpen[w]);
            wait = start - ready;
        }
        else
        {
            double close = instance.WindowClose[last];
            late = ready - close;
            start = instance.Rules.TimeWindows.Hard ? close : ready;
        }

        st.Late += late;
        if (choice == WaitAsPart)
        {
            // A wait long enough for a full break may instead stand as a split break's first part (only its end is
            // the break; the rest is time at the stop): the next break is then the shorter second part.
            if (!(lim.Waiting && lim.Split && !st.Part && st.Drive > Eps && wait >= lim.Full - Eps))
            {
                return false;
            }

            Take(ref st, start - lim.First, lim.First, k, BreakPlace.Waiting, true, breaks);
        }
        else if (lim.Waiting && wait > Eps && (st.Drive > Eps || st.Part))
        {
            if (wait >= lim.Full - Eps || (st.Part && wait >= lim.Second - Eps))
            {
                Take(ref st, ready, wait, k, BreakPlace.Waiting, false, breaks);
            }
            else if (lim.Split && !st.Part && wait >= lim.First - Eps)
            {
                Take(ref st, ready, wait, k, BreakPlace.Waiting, true, breaks);
            }
        }

        double leave = start + instance.Service[s];
        if (!visits.IsEmpty)
        {
            visits[k] = new VisitTimes { Arrival = arrival, Wait = wait, Start = start, Departure = leave, Late = late, Drive = st.RowDrive };
        }

        st.RowDrive = 0;
        if (choice == BreakAfter)
        {
            if (!(st.Drive > Eps || st.Part))
            {
                return false;
            }

            double need = st.Part ? lim.Second : lim.Full;
            Take(ref st, leave, need, k, BreakPlace.AfterService, false, breaks);
            leave += need;
        }

        st.T = leave;
        return true;
    }

    /// <summary>A break from <paramref name="start"/>: a full one (or the part completing a split one) resets the driving.</summary>
    private static void Take(ref Label st, double start, double minutes, int k, BreakPlace place, bool firstPart, List<PlannedBreak>? breaks)
    {
        breaks?.Add(new PlannedBreak(start, start + minutes, k, place, st.RowDrive, firstPart));
        st.RowDrive = 0;
        st.Count++;
        st.Breaks += minutes;
        if (firstPart)
        {
            st.Part = true;
            return;
        }

        st.Drive = 0;
        st.Part = false;
    }
}
