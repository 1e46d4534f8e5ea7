using Anneal.Core.Model;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// Each route's prefix and suffix load data (<see cref="LoadSegment"/>) for jobs where stops also collect, so that a
/// drafted route's fullest point is found by concatenating a few of them, as <see cref="SegmentCache"/> does for
/// time and distance. Delivery-only jobs never build one: there the departure is the fullest point and the route
/// total is enough.
/// </summary>
internal sealed class LoadCache
{
    private readonly Instance _instance;
    private readonly int[][] _stops;
    private readonly int[] _length;
    private readonly LoadSegment[] _node;
    private readonly LoadSegment[][] _prefix;
    private readonly LoadSegment[][] _suffix;

    public LoadCache(Instance instance, RouteStore store)
    {
        _instance = instance;
        _stops = store.Stops;
        _length = store.Lengths;
        int dims = instance.DimensionCount;
        Span<double> depot = stackalloc double[dims];
        Span<double> end = stackalloc double[dims];
        _node = new LoadSegment[instance.StopCount];
        for (int i = 0; i < _node.Length; i++)
        {
            for (int d = 0; d < dims; d++)
            {
                depot[d] = instance.DepotLoad(i, d);
                end[d] = depot[d] - instance.Demand(i, d) + instance.Pickup(i, d);
            }

            _node[i] = LoadSegment.Node(depot, end);
        }

        _prefix = new LoadSegment[store.RouteCount][];
        _suffix = new LoadSegment[store.RouteCount][];
        for (int r = 0; r < _prefix.Length; r++)
        {
            _prefix[r] = new LoadSegment[8];
            _suffix[r] = new LoadSegment[8];
        }
    }

    /// <summary>Recomputes a route's load data after it changed.</summary>
    public void Rebuild(int route)
    {
        int len = _length[route];
        if (len == 0)
        {
            return;
        }

        if (_prefix[route].Length < len)
        {
            _prefix[route] = new LoadSegment[_stops[route].Length];
            _suffix[route] = new LoadSegment[_stops[route].Length];
        }

        var stops = _stops[route];
        var prefix = _prefix[route];
        var suffix = _suffix[route];
        prefix[0] = _node[stops[0]];
        for (int k = 1; k < len; k++)
        {
            prefix[k] = prefix[k - 1];
            LoadSegment.Extend(ref prefix[k], in _node[stops[k]]);
        }

        suffix[len - 1] = _node[stops[len - 1]];
        for (int k = len - 2; k >= 0; k--)
        {
            var head = _node[stops[k]];
            LoadSegment.Extend(ref head, in suffix[k + 1]);
            suffix[k] = head;
        }
    }

    /// <summary>The amount over capacity at the drafted route's fullest point, summed over dimensions (as RouteLoads).</summary>
    public double Overload(ref RouteDraft draft, int vehicle)
    {
        var acc = default(LoadSegment);
        for (int k = 0; k < draft.Count; k++)
        {
            ref Piece p = ref draft.Pieces[k];
            if (p.Route < 0)
            {
                LoadSegment.Extend(ref acc, in _node[p.Stop]);
                continue;
            }

            var stops = _stops[p.Route];
            if (!p.Reversed && p.From == 0)
            {
                LoadSegment.Extend(ref acc, in _prefix[p.Route][p.To]);
            }
            else if (!p.Reversed && p.To == _length[p.Route] - 1)
            {
                LoadSegment.Extend(ref acc, in _suffix[p.Route][p.From]);
            }
            else if (!p.Reversed)
            {
                for (int i = p.From; i <= p.To; i++)
                {
                    LoadSegment.Extend(ref acc, in _node[stops[i]]);
                }
            }
            else
            {
                for (int i = p.To; i >= p.From; i--)
                {
                    LoadSegment.Extend(ref acc, in _node[stops[i]]);
                }
            }
        }

        return Over(_instance, vehicle, acc.L0, acc.L1, acc.L2, acc.L3);
    }

    /// <summary>The amount over capacity, summed over the instance's dimensions (at most four), of loads l0..l3.</summary>
    internal static double Over(Instance instance, int vehicle, double l0, double l1, double l2, double l3)
    {
        int dims = instance.DimensionCount;
        if (dims == 0)
        {
            return 0;
        }

        double over = Math.Max(0, l0 - instance.Capacity(vehicle, 0));
        if (dims > 1)
        {
            over += Math.Max(0, l1 - instance.Capacity(vehicle, 1));
        }

        if (dims > 2)
        {
            over += Math.Max(0, l2 - instance.Capacity(vehicle, 2));
        }

        if (dims > 3)
        {
            over += Math.Max(0, l3 - instance.Capacity(vehicle, 3));
        }

        return over;
    }
}
