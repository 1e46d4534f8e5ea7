using Anneal.Core.Model;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// Counts the stops whose collect-and-deliver pair a drafted route breaks, as <c>RouteLoads.PairBreaks</c> does for a
/// whole route: a collection whose delivery is not later on the route, a delivery whose collection is not earlier.
/// One pass to note each stop's position, one to look up partners: O(route length), and only on jobs with pairs
/// (pair moves keep pairs whole, so most drafts there find none; the check is what makes a split pair hard-infeasible
/// for every other move).
/// </summary>
internal sealed class PairCheck
{
    private readonly RouteStore _store;
    private readonly int[] _partner;
    private readonly bool[] _collection;
    private readonly int[] _stops;
    private readonly int[] _position;
    private readonly int[] _seen;
    private int _stamp;

    public PairCheck(Instance instance, RouteStore store)
    {
        _store = store;
        int n = instance.StopCount;
        _partner = new int[n];
        _collection = new bool[n];
        for (int i = 0; i < n; i++)
        {
            _partner[i] = instance.Partner(i);
            _collection[i] = instance.IsCollection(i);
        }

        _stops = new int[n + 1];
        _position = new int[n];
        _seen = new int[n];
    }

    public int Breaks(ref RouteDraft draft)
    {
        int count = _store.Materialise(ref draft, _stops);
        if (++_stamp == int.MaxValue)
        {
            Array.Clear(_seen);
            _stamp = 1;
        }

        for (int k = 0; k < count; k++)
        {
            _seen[_stops[k]] = _stamp;
            _position[_stops[k]] = k;
        }

        int breaks = 0;
        for (int k = 0; k < count; k++)
        {
            int partner = _partner[_stops[k]];
            if (partner < 0)
            {
                continue;
            }

            bool here = _seen[partner] == _stamp;
            bool inOrder = _collection[_stops[k]] ? _position[partner] > k : _position[partner] < k;
            if (!here || !inOrder)
            {
                breaks++;
            }
        }

        return breaks;
    }
}
