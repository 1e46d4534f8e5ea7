using Anneal.Search.Moves;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Search.Tabu;

/// <summary>
/// The attributes (stop, route) that are tabu, until which iteration, and how often each was used (for
/// diversification). Column <c>routes</c> stands for the unserved pool. Each tenure is drawn from [0.5, 1.5] of
/// the base tenure.
/// </summary>
internal sealed class TabuList
{
    private readonly SearchState _state;
    private readonly SearchRandom _rng;
    private readonly int _columns;
    private readonly int[] _until;
    private readonly int[] _frequency;

    public TabuList(SearchState state, SearchRandom rng, double tenure)
    {
        _state = state;
        _rng = rng;
        Tenure = tenure;
        _columns = state.RouteCount + 1;
        _until = new int[state.StopCount * _columns];
        _frequency = new int[state.StopCount * _columns];
    }

    public double Tenure { get; }

    /// <summary>The column of the unserved pool.</summary>
    public int Pool => _columns - 1;

    /// <summary>Forgets every tabu (after a restart or at a new phase); frequencies stay.</summary>
    public void Clear() => Array.Clear(_until);

    /// <summary>Is moving stop u (route ru) by this slot's move with v (route rv) tabu at this iteration?</summary>
    public bool IsTabu(int u, int v, int ru, int rv, int slot, long iteration)
    {
        if (ru < 0)
        {
            return Until(u, rv) > iteration;
        }

        if (ru == rv)
        {
            // Within a route the attributes are the stops themselves: without this, a move and its reverse alternate forever.
            return Until(u, ru) > iteration || Until(v, ru) > iteration;
        }

        var move = PairMoves.Between[slot];
        return move.Kind switch
        {
            MoveKind.Relocate => Until(u, rv) > iteration,
            MoveKind.TwoOptStar when move.After => TailTabu(u, ru, rv, iteration) || TailTabu(v, rv, ru, iteration),
            _ => Until(u, rv) > iteration || Until(v, ru) > iteration,
        };
    }

    /// <summary>Is moving stop u alone to <paramref name="to"/> (a route, or <see cref="Pool"/>) tabu?</summary>
    public bool IsTabu(int u, int to, long iteration) => Until(u, to) > iteration;

    /// <summary>How often the slot's move for u and v used its attributes before.</summary>
    public int Frequency(int u, int v, int ru, int rv, int slot)
    {
        if (ru < 0 || ru == rv)
        {
            return rv >= 0 ? _frequency[(u * _columns) + rv] : 0;
        }

        return PairMoves.Between[slot].Kind == MoveKind.Swap
            ? _frequency[(u * _columns) + rv] + _frequency[(v * _columns) + ru]
            : _frequency[(u * _columns) + rv];
    }

    /// <summary>How often stop u went to <paramref name="to"/> before.</summary>
    public int Frequency(int u, int to) => _frequency[(u * _columns) + to];

    /// <summary>Forbids undoing the move: each stop that leaves a route may not return to it for a while.</summary>
    public void Mark(ref MoveDraft move, long iteration)
    {
        int until = Draw(iteration);
        if (move.Inserted >= 0)
        {
            Forbid(move.Inserted, Pool, move.A.Route, until);
            return;
        }

        // Stops of route A that the move sends elsewhere: compare old and new membership cheaply by pieces.
        MarkLeavers(ref move.A, until);
        if (move.RouteCount > 1)
        {
            MarkLeavers(ref move.B, until);
        }

        if (move.Dropped >= 0)
        {
            Forbid(move.Dropped, _state.RouteOf(move.Dropped), Pool, until);
        }
    }

    /// <summary>Within a route the move's two stops are the attributes: neither may move again within its route for a while.</summary>
    public void MarkWithin(int u, int v, int route, long iteration)
    {
        int until = Draw(iteration);
        _until[(u * _columns) + route] = until;
        if (v >= 0)
        {
            _until[(v * _columns) + route] = until;
        }
    }

    private int Draw(long iteration) => (int)iteration + (int)Math.Round(Tenure * (0.5 + _rng.NextDouble()));

    private int Until(int stop, int column) => _until[(stop * _columns) + column];

    // 2-opt* after x hands x's successor (and the rest) to the other route.
    private bool TailTabu(int x, int rx, int to, long iteration)
    {
        int p = _state.PositionOf(x) + 1;
        return p < _state.Length(rx) && Until(_state.StopAt(rx, p), to) > iteration;
    }

    // Pieces that come from another route bring stops into this route: forbid their way back.
    private void MarkLeavers(ref RouteDraft draft, int until)
    {
        for (int k = 0; k < draft.Count; k++)
        {
            ref var piece = ref draft.Pieces[k];
            if (piece.Route < 0 || piece.Route == draft.Route)
            {
                continue;
            }

            int first = _state.StopAt(piece.Route, piece.Reversed ? piece.To : piece.From);
            Forbid(first, piece.Route, draft.Route, until);
        }
    }

    private void Forbid(int stop, int from, int to, int until)
    {
        if (from >= 0)
        {
            _until[(stop * _columns) + from] = until;
        }

        if (to >= 0)
        {
            _frequency[(stop * _columns) + to]++;
        }
    }
}
