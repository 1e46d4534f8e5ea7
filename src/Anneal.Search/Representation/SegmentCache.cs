using System.Runtime.CompilerServices;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// Each route's prefix and suffix summaries (<see cref="Segment"/>), and the same with the route's own depots
/// attached (head and tail), so that a drafted route is measured by concatenating a few of them. Where
/// concatenation is not exact (soft or several windows, more than four dimensions) a draft is measured by the
/// scheduler's forward pass instead.
/// </summary>
public sealed class SegmentCache
{
    private readonly Instance _instance;
    private readonly CostTable _costs;
    private readonly TravelTable _travel;
    private readonly int[][] _stops;
    private readonly int[] _length;
    private readonly RouteStore _store;
    private readonly Segment[][] _prefix;
    private readonly Segment[][] _suffix;

    // A move that keeps a route's head or tail costs one concatenation less at each end.
    private readonly Segment[][] _head;
    private readonly Segment[][] _tail;
    private readonly Segment[] _node;
    private readonly Segment[] _depotStart;
    private readonly Segment[] _depotEnd;
    private readonly int[] _scratch;

    // Only for jobs where stops also collect: the load then changes along the route (null when delivery-only).
    private readonly LoadCache? _loads;

    // Only for jobs with collect-and-deliver pairs (null otherwise).
    private readonly PairCheck? _pairs;

    public SegmentCache(Instance instance, RouteStore store)
    {
        _instance = instance;
        _costs = instance.Costs;
        _travel = instance.Travel;
        _store = store;
        _stops = store.Stops;
        _length = store.Lengths;
        FastPath = instance.Rules.TimeWindows.Hard && instance.SingleWindows && instance.DimensionCount <= 4 && !instance.Costs.PricesStability;
        int routes = store.RouteCount;
        _prefix = new Segment[routes][];
        _suffix = new Segment[routes][];
        _head = new Segment[routes][];
        _tail = new Segment[routes][];
        for (int r = 0; r < routes; r++)
        {
            _prefix[r] = new Segment[8];
            _suffix[r] = new Segment[8];
            _head[r] = new Segment[8];
            _tail[r] = new Segment[8];
        }

        int n = instance.StopCount;
        _scratch = new int[n + 1];
        _node = new Segment[n];
        for (int i = 0; i < n; i++)
        {
            var hull = instance.Hull(i);
            _node[i] = Segment.Node(i, instance.ServiceTime(i), hull.Open, hull.Close,
                Dim(instance, i, 0), Dim(instance, i, 1), Dim(instance, i, 2), Dim(instance, i, 3), instance.Stops[i].Needs);
        }

        _depotStart = new Segment[routes];
        _depotEnd = new Segment[routes];
        for (int v = 0; v < routes; v++)
        {
            var veh = instance.Vehicles[v];
            _depotStart[v] = Segment.Depot(instance.DepotLocation(veh.StartDepot), veh.ShiftStart, veh.ShiftEnd);
            _depotEnd[v] = Segment.Depot(instance.DepotLocation(veh.EndDepot), double.NegativeInfinity, double.PositiveInfinity);
        }

        _loads = FastPath && instance.HasPickups ? new LoadCache(instance, store) : null;
        _pairs = FastPath && instance.HasPairs ? new PairCheck(instance, store) : null;
    }

    /// <summary>Segment concatenation is exact here: hard single windows, at most four dimensions and no stability price (for vehicles without driving rules).</summary>
    public bool FastPath { get; }

    private static double Dim(Instance instance, int stop, int d) => d < instance.DimensionCount ? instance.Demand(stop, d) : 0;

    /// <summary>Recomputes a route's summaries after it changed.</summary>
    internal void Rebuild(int route)
    {
        int len = _length[route];
        if (!FastPath || len == 0)
        {
            return;
        }

        if (_prefix[route].Length < len)
        {
            int size = _stops[route].Length;
            _prefix[route] = new Segment[size];
            _suffix[route] = new Segment[size];
            _head[route] = new Segment[size];
            _tail[route] = new Segment[size];
        }

        var travel = _travel;
        var stops = _stops[route];
        var prefix = _prefix[route];
        var suffix = _suffix[route];
        prefix[0] = _node[stops[0]];
        for (int k = 1; k < len; k++)
        {
            prefix[k] = prefix[k - 1];
            Append(ref prefix[k], in _node[stops[k]], travel);
        }

        suffix[len - 1] = _node[stops[len - 1]];
        for (int k = len - 2; k >= 0; k--)
        {
            var head = _node[stops[k]];
            Append(ref head, in suffix[k + 1], travel);
            suffix[k] = head;
        }

        var heads = _head[route];
        var tails = _tail[route];
        for (int k = 0; k < len; k++)
        {
            heads[k] = _depotStart[route];
            Append(ref heads[k], in prefix[k], travel);
            tails[k] = suffix[k];
            Append(ref tails[k], in _depotEnd[route], travel);
        }

        _loads?.Rebuild(route);
    }

    /// <summary>The measures of the route a draft describes, as the scheduler would give them for its stops.</summary>
    /// <remarks>
    /// A vehicle with driving rules is measured by the scheduler, breaks and all: where breaks go depends on the whole
    /// route, which a segment summary does not hold. Routes of other vehicles keep the concatenation.
    /// </remarks>
    public RouteMetrics Measure(ref RouteDraft draft) =>
        FastPath && !_costs.HasDrivingRules(draft.Route) ? MeasureBySegments(ref draft) : MeasureByScheduler(ref draft);

    private RouteMetrics MeasureByScheduler(ref RouteDraft draft)
    {
        int count = _store.Materialise(ref draft, _scratch);
        return RouteScheduler.Measure(_instance, draft.Route, _scratch.AsSpan(0, count));
    }

    private RouteMetrics MeasureBySegments(ref RouteDraft draft)
    {
        var travel = _travel;
        int vehicle = draft.Route;
        int first = 0, last = draft.Count;
        Segment acc;
        if (draft.Count > 0 && StartsLikeHead(in draft.Pieces[0], vehicle))
        {
            ref Piece p = ref draft.Pieces[0];
            acc = _head[p.Route][p.To];
            first = 1;
        }
        else
        {
            acc = _depotStart[vehicle];
        }

        bool tail = last > first && EndsLikeTail(in draft.Pieces[last - 1], vehicle);
        if (tail)
        {
            last--;
        }

        for (int k = first; k < last; k++)
        {
            ref Piece p = ref draft.Pieces[k];
            if (p.Route < 0)
            {
                Append(ref acc, in _node[p.Stop], travel);
                continue;
            }

            int r = p.Route;
            int len = _length[r];
            if (!p.Reversed && p.From == 0 && p.To - p.From >= 2)
            {
                Append(ref acc, in _prefix[r][p.To], travel);
            }
            else if (!p.Reversed && p.To == len - 1 && p.To - p.From >= 2)
            {
                Append(ref acc, in _suffix[r][p.From], travel);
            }
            else if (!p.Reversed)
            {
                var stops = _stops[r];
                for (int i = p.From; i <= p.To; i++)
                {
                    Append(ref acc, in _node[stops[i]], travel);
                }
            }
            else
            {
                var stops = _stops[r];
                for (int i = p.To; i >= p.From; i--)
                {
                    Append(ref acc, in _node[stops[i]], travel);
                }
            }
        }

        if (tail)
        {
            ref Piece p = ref draft.Pieces[draft.Count - 1];
            Append(ref acc, in _tail[p.Route][p.From], travel);
        }
        else if (acc.Count > 0)
        {
            Append(ref acc, in _depotEnd[vehicle], travel);
        }

        var m = default(RouteMetrics);
        m.StopCount = acc.Count;
        if (acc.Count == 0)
        {
            return m;
        }

        var costs = _costs;
        m.Distance = acc.Distance;
        m.Duration = acc.Duration;
        m.TimeWindowViolation = acc.TimeWarp;
        m.Departure = acc.Earliest;
        m.Return = acc.Earliest + acc.Duration - acc.TimeWarp;
        m.Overtime = Math.Max(0, m.Return - costs.ShiftEnd(vehicle));
        m.DurationExcess = Math.Max(0, m.Duration - costs.MaxDuration(vehicle));
        m.Overload = _loads is null ? Overload(vehicle, in acc) : _loads.Overload(ref draft, vehicle);
        m.MissingEquipment = System.Numerics.BitOperations.PopCount(acc.Needs & ~costs.Equipment(vehicle));
        m.PairBreaks = _pairs is null ? 0 : _pairs.Breaks(ref draft);
        return m;
    }

    // A route's stored head stands in for a draft's start when it begins that route and the draft's vehicle leaves
    // from the same depot at the same shift start; a stored tail likewise needs the same end depot.
    private bool StartsLikeHead(in Piece p, int vehicle) =>
        p.Route >= 0 && !p.Reversed && p.From == 0 && p.To >= 0 && p.To < _length[p.Route]
        && (p.Route == vehicle || SameStart(p.Route, vehicle));

    private bool EndsLikeTail(in Piece p, int vehicle) =>
        p.Route >= 0 && !p.Reversed && p.To == _length[p.Route] - 1 && p.From <= p.To
        && (p.Route == vehicle || _depotEnd[p.Route].First == _depotEnd[vehicle].First);

    private bool SameStart(int a, int b)
    {
        ref readonly var x = ref _depotStart[a];
        ref readonly var y = ref _depotStart[b];
        return x.First == y.First && x.Earliest == y.Earliest && x.Latest == y.Latest;
    }

    private double Overload(int vehicle, in Segment s) => LoadCache.Over(_instance, vehicle, s.Load0, s.Load1, s.Load2, s.Load3);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Append(ref Segment acc, in Segment next, TravelTable travel)
    {
        travel.Arc(acc.Last, next.First, out double distance, out double duration);
        Segment.Extend(ref acc, in next, duration, distance);
    }
}
