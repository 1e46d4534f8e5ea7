using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Search.Moves;

/// <summary>
/// Draws one random move from the granular neighbourhoods: a random stop u, one of its candidate neighbours v,
/// and a move kind by fixed odds. Unserved stops are offered insertion; droppable ones may be dropped.
/// </summary>
public sealed class MoveSampler
{
    private readonly SearchState _state;
    private readonly CandidateLists _candidates;
    private readonly SearchRandom _rng;
    private readonly bool _anyDroppable;

    /// <summary>One draw in this many picks an unserved stop when there are any.</summary>
    private const int UnservedOdds = 8;

    public MoveSampler(SearchState state, CandidateLists candidates, SearchRandom rng)
    {
        _state = state;
        _candidates = candidates;
        _rng = rng;
        for (int i = 0; i < state.StopCount; i++)
        {
            _anyDroppable |= state.Instance.MayDrop(i);
        }
    }

    public bool Next(ref MoveDraft m)
    {
        var s = _state;
        int n = s.StopCount;
        if (n == 0 || _candidates.K == 0)
        {
            return false;
        }

        // Unserved stops are few; drawing them more often than their share lets an emptied route's stops find homes.
        int u = s.UnservedCount > 0 && _rng.Next(UnservedOdds) == 0 ? s.UnservedAt(_rng.Next(s.UnservedCount)) : _rng.Next(n);
        int v = _candidates.At(u, _rng.Next(_candidates.K));
        if (s.RouteOf(u) < 0)
        {
            if (s.RouteOf(v) >= 0)
            {
                return MoveBuilder.Insert(s, ref m, u, v, _rng.Next(2) == 0);
            }

            return MoveBuilder.Insert(s, ref m, u, -1, false, RandomEmptyRoute());
        }

        if (s.RouteOf(v) < 0)
        {
            return false;
        }

        int roll = _rng.Next(100);
        if (roll < 28)
        {
            return MoveBuilder.Relocate(s, ref m, u, v, _rng.Next(2) == 0);
        }

        if (roll < 38)
        {
            return MoveBuilder.Relocate(s, ref m, u, v, _rng.Next(2) == 0, chain: _rng.Next(2, 4));
        }

        if (roll < 52)
        {
            return MoveBuilder.Exchange(s, ref m, u, v);
        }

        if (roll < 62)
        {
            return MoveBuilder.Exchange(s, ref m, u, v, _rng.Next(1, 4), _rng.Next(1, 4));
        }

        if (roll < 84)
        {
            return s.RouteOf(u) != s.RouteOf(v)
                ? MoveBuilder.TwoOptStar(s, ref m, u, v, _rng.Next(2) == 0)
                : MoveBuilder.TwoOpt(s, ref m, u, v);
        }

        if (roll < 96)
        {
            int ru = s.RouteOf(u);
            int w = s.StopAt(ru, _rng.Next(s.Length(ru)));
            return MoveBuilder.TwoOpt(s, ref m, u, w);
        }

        if (roll < 98 && _anyDroppable && s.Instance.MayDrop(u))
        {
            return MoveBuilder.Drop(s, ref m, u);
        }

        int empty = RandomEmptyRoute();
        return empty >= 0 && MoveBuilder.ToEmptyRoute(s, ref m, u, empty);
    }

    /// <summary>An unused vehicle chosen at random (scan from a random start), or -1.</summary>
    public int RandomEmptyRoute()
    {
        int count = _state.RouteCount;
        int start = _rng.Next(count);
        for (int k = 0; k < count; k++)
        {
            int r = (start + k) % count;
            if (_state.Length(r) == 0)
            {
                return r;
            }
        }

        return -1;
    }
}
