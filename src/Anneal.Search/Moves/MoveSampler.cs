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
    private readonly bool _pairs;

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

        _pairs = state.Instance.HasPairs;
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
        if (_pairs && (roll >= 96 || (roll < 62 && s.RouteOf(u) != s.RouteOf(v))) && PairMoveBuilder.Ends(s, u, out _, out _))
        {
            // One end of a whole pair alone on another route would break it: both ends move together instead. (An
            // end whose pair is broken already moves alone, which can mend it.)
            return PairMove(ref m, u, v, roll);
        }

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

    /// <summary>
    /// A pair relocation beside v on v's (other) route, the other end beside one of its own candidate neighbours there
    /// when that one comes in the right order, else next to the first end; a pair exchange with v's pair; or the pair
    /// onto an empty route.
    /// </summary>
    private bool PairMove(ref MoveDraft m, int u, int v, int roll)
    {
        var s = _state;
        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        if (roll >= 96)
        {
            int empty = RandomEmptyRoute();
            return empty >= 0 && PairMoveBuilder.Relocate(s, ref m, u, empty, 0, 0);
        }

        if (roll < 40)
        {
            int partner = s.Instance.Partner(u);
            int gapU = s.PositionOf(v) + _rng.Next(2);
            int w = _candidates.At(partner, _rng.Next(_candidates.K));
            bool collection = s.Instance.IsCollection(u);
            int gapW = s.RouteOf(w) == rv ? s.PositionOf(w) + _rng.Next(2) : gapU;
            if (collection ? gapW < gapU : gapW > gapU)
            {
                gapW = gapU;
            }

            return collection
                ? PairMoveBuilder.Relocate(s, ref m, u, rv, gapU, gapW)
                : PairMoveBuilder.Relocate(s, ref m, u, rv, gapW, gapU);
        }

        return PairMoveBuilder.Exchange(s, ref m, u, v);
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
