using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Bounds.Safety;

namespace Anneal.Bounds.Relaxation;

/// <summary>
/// The instance as every bound in this project sees it: a problem whose optimum is at most the optimum of the
/// instance's objective over plans that keep every hard rule. What is given up, and why that keeps the bound valid:
/// <list type="bullet">
/// <item>A soft rule (late arrival, overload, overtime, excess duration) only ever adds its price to a plan's
/// objective; dropping the rule and its price leaves every plan allowed and no dearer, so a bound of the problem
/// without it is a bound of the problem with it.</item>
/// <item>Driver time (cost per hour) is counted as driving plus service only: a route's duration is return minus
/// departure, which is at least the time spent driving and serving, so waiting is left out, never added.</item>
/// <item>A hard maximum route duration is dropped (a route allowed with it is allowed without it).</item>
/// <item>Arrivals may exceed a hard window close or the shift end, and loads a hard capacity, by the evaluator's
/// feasibility tolerance (<see cref="Tolerance"/>), as the evaluator allows.</item>
/// </list>
/// Every vehicle drives at most one route, so a kind of vehicle has at most <see cref="RouteKind.Count"/> routes.
/// </summary>
public sealed class RelaxedInstance
{
    private readonly double[] _service;

    public Instance Instance { get; }

    public int StopCount { get; }

    /// <summary>Lower bounds on travel between locations along any route; null when no hard rule depends on time.</summary>
    public ShortestTimes? Paths { get; }

    /// <summary>Service starts under the windows, as the evaluator schedules them.</summary>
    public ServiceStart Starts { get; }

    public IReadOnlyList<RouteKind> Kinds { get; }

    /// <summary>True for a stop that every plan keeping the hard rules serves.</summary>
    public bool[] Required { get; }

    /// <summary>Price of leaving a stop out (0 for a required stop, where leaving it out is not allowed).</summary>
    public double[] DropPrice { get; }

    /// <summary>Objective that every plan pays whatever its routes: stops no vehicle can serve are always left out.</summary>
    public double Constant { get; }

    /// <summary>True when time windows are hard (their closes limit arrivals).</summary>
    public bool HardWindows { get; }

    /// <summary>What the relaxation gives up, in words, for the solver's notes.</summary>
    public IReadOnlyList<string> Relaxed { get; }

    /// <summary>Why no bound can be offered (null when one can).</summary>
    public string? Declined { get; }

    private RelaxedInstance(Instance instance, ServiceStart starts, ShortestTimes? paths, IReadOnlyList<RouteKind> kinds, bool[] required, double[] drop, double constant, IReadOnlyList<string> relaxed, string? declined)
    {
        Instance = instance;
        Starts = starts;
        Paths = paths;
        StopCount = instance.StopCount;
        Kinds = kinds;
        Required = required;
        DropPrice = drop;
        Constant = constant;
        HardWindows = instance.Rules.TimeWindows.Hard;
        Relaxed = relaxed;
        Declined = declined;
        _service = new double[instance.StopCount + instance.Depots.Count];
        for (int i = 0; i < instance.StopCount; i++)
        {
            _service[i] = instance.ServiceTime(i);
        }
    }

    /// <summary>Objective of driving from <paramref name="from"/> to <paramref name="to"/> with a vehicle of <paramref name="kind"/>, including the service at <paramref name="from"/> when it is a stop.</summary>
    public double ArcCost(RouteKind kind, int from, int to)
    {
        var travel = Instance.Travel;
        double cost = kind.PerDistance * travel.Distance(from, to);
        return kind.PerTime == 0 ? cost : cost + (kind.PerTime * (travel.Duration(from, to) + _service[from]));
    }

    /// <summary>Service time at a location (0 at a depot).</summary>
    public double Service(int location) => _service[location];

    public static RelaxedInstance Build(Instance instance)
    {
        var rules = instance.Rules;
        var relaxed = new List<string>();
        string? declined = NegativePrice(instance);
        var starts = new ServiceStart(instance);
        bool timed = rules.TimeWindows.Hard || rules.ShiftEnd.Hard;
        var paths = timed ? new ShortestTimes(instance) : null;
        var kinds = GroupKinds(instance, starts, paths!);
        int n = instance.StopCount;
        var required = new bool[n];
        var drop = new double[n];
        double constant = 0;
        for (int i = 0; i < n && declined is null; i++)
        {
            bool served = false;
            foreach (var k in kinds)
            {
                served |= k.Serves[i];
            }

            if (instance.MayDrop(i))
            {
                drop[i] = instance.UnservedPrice(i);
                if (!served)
                {
                    constant += drop[i];
                }
            }
            else if (served)
            {
                required[i] = true;
            }
            else
            {
                declined = $"stop {instance.Stops[i].Id} must be served but no vehicle can serve it within the hard rules, so no plan keeps them";
            }
        }

        Note(relaxed, !rules.TimeWindows.Hard, "soft time windows (late arrival only adds its price)");
        Note(relaxed, !rules.Capacity.Hard, "soft capacity (overload only adds its price)");
        Note(relaxed, !rules.ShiftEnd.Hard, "soft shift end (overtime only adds its price)");
        bool anyDuration = false, anyHourly = false;
        foreach (var v in instance.Vehicles)
        {
            anyDuration |= !double.IsPositiveInfinity(v.MaxDuration);
            anyHourly |= v.CostPerHour > 0;
        }

        Note(relaxed, anyDuration, rules.MaxDuration.Hard ? "maximum route duration" : "soft maximum route duration (its excess only adds its price)");
        Note(relaxed, anyHourly && instance.Objective == Objective.Cost, "driver time counted as driving and service, without waiting");
        return new RelaxedInstance(instance, starts, paths, kinds, required, drop, constant, relaxed, declined);
    }

    private static void Note(List<string> list, bool when, string what)
    {
        if (when)
        {
            list.Add(what);
        }
    }

    private static string? NegativePrice(Instance instance)
    {
        var r = instance.Rules;
        bool negative = r.TimeWindows.Price < 0 || r.Capacity.Price < 0 || r.ShiftEnd.Price < 0 || r.MaxDuration.Price < 0;
        foreach (var v in instance.Vehicles)
        {
            negative |= v.FixedCost < 0 || v.CostPerDistance < 0 || v.CostPerHour < 0;
        }

        for (int i = 0; i < instance.StopCount; i++)
        {
            negative |= instance.MayDrop(i) && !(instance.UnservedPrice(i) >= 0);
        }

        for (int a = 0; a < instance.Travel.Count && !negative && instance.Travel.IsDense; a++)
        {
            for (int b = 0; b < instance.Travel.Count; b++)
            {
                negative |= !(instance.Travel.Distance(a, b) >= 0) || !(instance.Travel.Duration(a, b) >= 0);
            }
        }

        return negative ? "a price, a cost rate or a travel value is negative (or not a number); the bounds assume none is" : null;
    }

    /// <summary>The kind of each vehicle of the fleet.</summary>
    public int KindOf(int vehicle)
    {
        string key = Key(Instance, Instance.Vehicles[vehicle]);
        for (int k = 0; k < Kinds.Count; k++)
        {
            if (Key(Instance, Instance.Vehicles[Kinds[k].Representative]) == key)
            {
                return k;
            }
        }

        return -1;
    }

    private static List<RouteKind> GroupKinds(Instance instance, ServiceStart starts, ShortestTimes paths)
    {
        var byKey = new Dictionary<string, int>(StringComparer.Ordinal);
        var counts = new List<int>();
        var first = new List<int>();
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            string key = Key(instance, instance.Vehicles[v]);
            if (byKey.TryGetValue(key, out int k))
            {
                counts[k]++;
            }
            else
            {
                byKey[key] = counts.Count;
                counts.Add(1);
                first.Add(v);
            }
        }

        var kinds = new List<RouteKind>(counts.Count);
        for (int k = 0; k < counts.Count; k++)
        {
            kinds.Add(Kind(instance, starts, paths, first[k], counts[k]));
        }

        return kinds;
    }

    private static RouteKind Kind(Instance instance, ServiceStart starts, ShortestTimes paths, int vehicle, int count)
    {
        var v = instance.Vehicles[vehicle];
        var rules = instance.Rules;
        int dims = instance.DimensionCount;
        var capacity = new double[dims];
        for (int d = 0; d < dims; d++)
        {
            capacity[d] = rules.Capacity.Hard ? Tolerance.Widen(v.Capacity[d]) : double.PositiveInfinity;
        }

        double latest = rules.ShiftEnd.Hard ? Tolerance.Widen(v.ShiftEnd) : double.PositiveInfinity;
        var (fixedCost, perDistance, perTime) = CostTable.RatesOf(instance, v);
        var kind = new RouteKind
        {
            Count = count,
            Representative = vehicle,
            FixedCost = fixedCost,
            PerDistance = perDistance,
            PerTime = perTime,
            Start = instance.DepotLocation(v.StartDepot),
            End = instance.DepotLocation(v.EndDepot),
            Capacity = capacity,
            ShiftStart = v.ShiftStart,
            LatestReturn = latest,
            Serves = new bool[instance.StopCount],
            TimeMatters = rules.TimeWindows.Hard || !double.IsPositiveInfinity(latest),
        };
        for (int i = 0; i < instance.StopCount; i++)
        {
            kind.Serves[i] = Alone(instance, starts, paths, kind, v, i);
        }

        return kind;
    }

    /// <summary>Can the kind serve the stop on a route of its own within the hard rules (so possibly on any route)?</summary>
    private static bool Alone(Instance instance, ServiceStart starts, ShortestTimes paths, RouteKind kind, Vehicle v, int stop)
    {
        if ((instance.Stops[stop].Needs & ~v.Equipment) != 0)
        {
            return false;
        }

        for (int d = 0; d < instance.DimensionCount; d++)
        {
            if (instance.Demand(stop, d) > kind.Capacity[d])
            {
                return false;
            }
        }

        if (!kind.TimeMatters)
        {
            return true;
        }

        double start = starts.At(stop, kind.ShiftStart + paths.Between(kind.Start, stop));
        return !double.IsNaN(start) && start + instance.ServiceTime(stop) + paths.Between(stop, kind.End) <= kind.LatestReturn;
    }

    private static string Key(Instance instance, Vehicle v)
    {
        var parts = new List<string> { v.StartDepot.ToString(CultureInfo.InvariantCulture), v.EndDepot.ToString(CultureInfo.InvariantCulture), v.Equipment.ToString(CultureInfo.InvariantCulture) };
        foreach (double q in v.Capacity)
        {
            parts.Add(R(q));
        }

        parts.Add(R(v.ShiftStart));
        parts.Add(R(v.ShiftEnd));
        if (instance.Objective == Objective.Cost)
        {
            parts.Add(R(v.FixedCost));
            parts.Add(R(v.CostPerDistance));
            parts.Add(R(v.CostPerHour));
        }

        return string.Join('|', parts);
    }

    private static string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);
}
