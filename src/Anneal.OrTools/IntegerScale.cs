using Anneal.Core.Model;

namespace Anneal.OrTools;

/// <summary>
/// The one place where Anneal's real-valued times, loads and costs become the integers OR-Tools needs.
/// <para>
/// Times and loads: by default 1000 integer steps per unit (a Solomon time unit or a minute becomes 1/1000 of itself).
/// Hard limits round conservatively — travel plus service up, window opens up, closes and capacities down, demands
/// up — so every plan OR-Tools finds feasible is feasible for Anneal's evaluator too.
/// </para>
/// <para>
/// Costs: the largest power of ten up to 10^8 (by default) per objective unit that keeps a generous objective bound under 10^14,
/// far from the int64 limit OR-Tools sums in. Cost rates per time or load step are then
/// price × CostScale / steps; they round to the nearest integer and <see cref="Notes"/> says when that moved a rate
/// by more than one part in ten thousand.
/// </para>
/// </summary>
public sealed class IntegerScale
{
    /// <summary>Routing default: integer steps per time unit and per load unit.</summary>
    public const double DefaultSteps = 1000;
    private const double Slop = 1e-7;
    private const double MaxTotal = 1e14;
    private readonly List<string> _notes = [];

    public Instance Instance { get; }

    /// <summary>Integer steps per time unit.</summary>
    public double TimeScale { get; }

    /// <summary>Integer steps per load unit.</summary>
    public double LoadScale { get; }

    /// <summary>Integer cost steps per objective unit.</summary>
    public double CostScale { get; }

    /// <summary>Earliest time of the instance (0 unless something starts earlier); scaled times count from here.</summary>
    public double Origin { get; }

    /// <summary>Latest scaled time any schedule needs, soft lateness included.</summary>
    public long Horizon { get; }

    /// <summary>Largest relative change rounding made to a cost rate so far (0 when every rate was whole).</summary>
    public double MaxRateError { get; private set; }

    /// <summary><see cref="Horizon"/> before the cast to an integer (infinite or huge when a time is), for <see cref="ScalingGuard"/>.</summary>
    public double HorizonSteps { get; }

    /// <summary>A generous bound on any plan's objective, in objective units (infinite when a price or distance is), for <see cref="ScalingGuard"/>.</summary>
    public double ObjectiveBound { get; }

    /// <summary>Rounding that changed a cost rate noticeably ("approximated: ...").</summary>
    public IReadOnlyList<string> Notes => _notes;

    /// <param name="timeScale">Steps per time unit (1000 by default; the exact model uses coarser steps, which CP-SAT proves faster).</param>
    /// <param name="loadScale">Steps per load unit.</param>
    /// <param name="maxCostScale">Largest cost steps per objective unit.</param>
    public IntegerScale(Instance instance, double timeScale = DefaultSteps, double loadScale = DefaultSteps, double maxCostScale = 1e8)
    {
        Instance = instance;
        TimeScale = timeScale;
        LoadScale = loadScale;
        Origin = EarliestTime(instance);
        double latest = LatestTime(instance);
        HorizonSteps = Math.Ceiling((latest - Origin) * TimeScale) + 1;
        Horizon = HorizonSteps < long.MaxValue / 2 ? (long)HorizonSteps : long.MaxValue / 2;
        double bound = Bound(instance, latest - Origin);
        ObjectiveBound = bound;
        double scale = maxCostScale;
        while (scale > 1 && bound * scale > MaxTotal)
        {
            scale /= 10;
        }

        CostScale = scale;
    }

    /// <summary>Scaled travel time from location a to b plus the service at a (a stop) — rounded up.</summary>
    public long Transit(int from, int to)
    {
        var inst = Instance;
        if (from >= inst.StopCount && to >= inst.StopCount)
        {
            return 0; // depot to depot is only an empty route, which Anneal does not drive
        }

        double service = from < inst.StopCount ? inst.ServiceTime(from) : 0;
        return Up((service + inst.Travel.Duration(from, to)) * TimeScale);
    }

    /// <summary>A time point where a hard lower limit applies (window open, shift start): rounded up.</summary>
    public long TimeUp(double t) => double.IsNegativeInfinity(t) ? 0 : Math.Clamp(Up((t - Origin) * TimeScale), 0, Horizon);

    /// <summary>A time point where a hard upper limit applies (window close, shift end): rounded down.</summary>
    public long TimeDown(double t) => double.IsPositiveInfinity(t) ? Horizon : Math.Clamp(Down((t - Origin) * TimeScale), 0, Horizon);

    /// <summary>A time point where a soft limit starts costing: nearest.</summary>
    public long TimeNearest(double t) => double.IsPositiveInfinity(t) ? Horizon : Math.Clamp((long)Math.Round((t - Origin) * TimeScale), 0, Horizon);

    /// <summary>A duration limit (maximum route duration): rounded down.</summary>
    public long DurationDown(double d) => double.IsPositiveInfinity(d) ? Horizon : Math.Clamp(Down(d * TimeScale), 0, Horizon);

    /// <summary>A duration where a soft limit starts costing: nearest.</summary>
    public long DurationNearest(double d) => double.IsPositiveInfinity(d) ? Horizon : Math.Clamp((long)Math.Round(d * TimeScale), 0, Horizon);

    public long DemandUp(double q) => Up(q * LoadScale);

    public long CapacityDown(double q) => double.IsPositiveInfinity(q) ? long.MaxValue / 4 : Down(q * LoadScale);

    public long LoadNearest(double q) => (long)Math.Round(q * LoadScale);

    /// <summary>A lump-sum cost (fixed vehicle cost, unserved penalty, one arc's cost).</summary>
    public long Cost(double c) => (long)Math.Round(Math.Min(c, MaxTotal) * CostScale);

    /// <summary>A cost per time step (price per time unit); notes the rounding when it matters.</summary>
    public long PerTimeStep(double pricePerUnit, string what) => Rate(pricePerUnit * CostScale / TimeScale, what);

    /// <summary>A cost per load step (price per unit over capacity); notes the rounding when it matters.</summary>
    public long PerLoadStep(double pricePerUnit, string what) => Rate(pricePerUnit * CostScale / LoadScale, what);

    /// <summary>An integer objective back in Anneal's units.</summary>
    public double ToObjective(double scaled) => scaled / CostScale;

    /// <summary>Time back in Anneal's units.</summary>
    public double ToTime(long scaled) => Origin + (scaled / TimeScale);

    private long Rate(double exact, string what)
    {
        long r = (long)Math.Round(exact);
        if (exact > 0)
        {
            MaxRateError = Math.Max(MaxRateError, Math.Abs(r - exact) / exact);
        }

        if (exact > 0 && Math.Abs(r - exact) > 1e-4 * exact)
        {
            string note = $"approximated: {what} rounded to {r} integer cost steps per step instead of {exact:G6}";
            if (!_notes.Contains(note))
            {
                _notes.Add(note);
            }
        }

        return r;
    }

    private static long Up(double x) => (long)Math.Ceiling(x - Slop);

    private static long Down(double x) => (long)Math.Floor(x + Slop);

    private static double EarliestTime(Instance inst)
    {
        double t = 0;
        foreach (var v in inst.Vehicles)
        {
            t = Math.Min(t, v.ShiftStart);
        }

        foreach (var s in inst.Stops)
        {
            foreach (var w in s.Windows)
            {
                if (!double.IsInfinity(w.Open))
                {
                    t = Math.Min(t, w.Open);
                }
            }
        }

        return t;
    }

    /// <summary>Latest finite time limit plus every service and the longest trip out of each place (room for lateness).</summary>
    private static double LatestTime(Instance inst)
    {
        double t = 0;
        foreach (var v in inst.Vehicles)
        {
            t = Math.Max(t, v.ShiftStart);
            if (!double.IsInfinity(v.ShiftEnd))
            {
                t = Math.Max(t, v.ShiftEnd);
            }
        }

        foreach (var s in inst.Stops)
        {
            foreach (var w in s.Windows)
            {
                if (!double.IsInfinity(w.Open))
                {
                    t = Math.Max(t, w.Open);
                }

                if (!double.IsInfinity(w.Close))
                {
                    t = Math.Max(t, w.Close);
                }
            }
        }

        int n = inst.Travel.Count;
        for (int i = 0; i < n; i++)
        {
            double longest = 0;
            for (int j = 0; j < n; j++)
            {
                longest = Math.Max(longest, inst.Travel.Duration(i, j));
            }

            t += longest + (i < inst.StopCount ? inst.ServiceTime(i) : 0);
        }

        return t;
    }

    /// <summary>A generous objective: every vehicle's fixed cost, every stop on its own return trip at the dearest rates, every penalty.</summary>
    /// <param name="span">Latest time less earliest time.</param>
    private static double Bound(Instance inst, double span)
    {
        double rate = 1, hourly = 0, fixedCost = 0;
        for (int k = 0; k < inst.Vehicles.Count; k++)
        {
            var rates = inst.Costs.Rates(k);
            rate = Math.Max(rate, rates.PerDistance);
            hourly = Math.Max(hourly, rates.PerTime);
            fixedCost += rates.Fixed;
        }

        double bound = fixedCost + 1;
        int depot = inst.Depots.Count > 0 ? inst.StopCount : 0;
        double softTime = 0;
        var r = inst.Rules;
        foreach (var rule in new[] { r.TimeWindows, r.ShiftEnd, r.MaxDuration })
        {
            softTime += rule.Hard ? 0 : rule.Price;
        }

        for (int i = 0; i < inst.StopCount; i++)
        {
            double trip = inst.Travel.Distance(depot, i) + inst.Travel.Distance(i, depot);
            bound += (trip * rate) + inst.UnservedPrice(i);
            if (!r.Capacity.Hard)
            {
                bound += r.Capacity.Price * inst.Stops[i].Demand.Sum();
            }
        }

        bound += span * (hourly + softTime) * Math.Max(1, inst.StopCount);
        return double.IsNaN(bound) ? double.PositiveInfinity : bound;
    }
}
