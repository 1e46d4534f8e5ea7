using Anneal.Search.Moves;
using Anneal.Search.Representation;

namespace Anneal.Search.Construction;

/// <summary>
/// Puts an unserved collect-and-deliver pair onto a route at its best pair of positions, collection first: every
/// collection gap and every delivery gap at or after it (O(length²) drafts per route, each measured by the segment
/// cache). Used by the construction, the ruin's recreate and the ejection pool, so that no pair is ever inserted one
/// end at a time.
/// </summary>
public sealed class PairInsertion
{
    /// <summary>Added to a position that breaks a hard rule, so that any clean position wins (as in the construction).</summary>
    public const double BreakSurcharge = 1e18;

    private readonly SearchState _state;
    private readonly int[] _buffer;
    private readonly int[] _seen;
    private int _stamp;
    private MoveDraft _move;

    public PairInsertion(SearchState state)
    {
        _state = state;
        _buffer = new int[state.StopCount];
        _seen = new int[state.RouteCount];
    }

    /// <summary>
    /// <see cref="Scan"/> on each route that serves a candidate neighbour of either end, once each; afterwards
    /// <see cref="Scanned"/> tells which routes were tried. Returns the drafts tried.
    /// </summary>
    public int ScanNear(int c, int d, Neighbourhoods.CandidateLists candidates, bool feasibleOnly, ref Choice best)
    {
        _stamp++;
        int tried = 0;
        for (int end = 0; end < 2; end++)
        {
            int e = end == 0 ? c : d;
            for (int k = 0; k < candidates.K; k++)
            {
                int r = _state.RouteOf(candidates.At(e, k));
                if (r >= 0 && _seen[r] != _stamp)
                {
                    _seen[r] = _stamp;
                    tried += Scan(c, d, r, feasibleOnly, ref best);
                }
            }
        }

        return tried;
    }

    /// <summary>Whether the last <see cref="ScanNear"/> tried this route.</summary>
    public bool Scanned(int route) => _seen[route] == _stamp;

    /// <summary>Where the best position found so far is, and what it costs.</summary>
    public struct Choice
    {
        public int Route;
        public int GapC;
        public int GapD;
        public double Cost;

        public static Choice None => new() { Route = -1, Cost = double.PositiveInfinity };
    }

    /// <summary>
    /// Tries every position of collection c and delivery d on the route; with <paramref name="feasibleOnly"/> only
    /// positions that keep the route to the hard rules, priced by the objective change, else every position, priced
    /// by the penalized change plus <see cref="BreakSurcharge"/> when it breaks a hard rule. Returns the drafts tried.
    /// </summary>
    public int Scan(int c, int d, int route, bool feasibleOnly, ref Choice best)
    {
        var s = _state;
        int len = s.Length(route);
        int tried = 0;
        for (int gc = 0; gc <= len; gc++)
        {
            for (int gd = gc; gd <= len; gd++)
            {
                tried++;
                PairMoveBuilder.Into(s, ref _move.A, route, Piece.Single(c), Piece.Single(d), gc, gd);
                double cost;
                if (feasibleOnly)
                {
                    if (!s.FeasibleChange(ref _move.A, out cost))
                    {
                        continue;
                    }
                }
                else
                {
                    _move.Reset(MoveKind.Insert);
                    _move.RouteCount = 1;
                    var parts = s.EvaluateParts(ref _move);
                    cost = parts.Penalized(s.Weights) + (parts.Violation.RouteTotal > 1e-9 ? BreakSurcharge : 0);
                }

                if (cost < best.Cost)
                {
                    best = new Choice { Route = route, GapC = gc, GapD = gd, Cost = cost };
                }
            }
        }

        return tried;
    }

    /// <summary>Puts the pair where the choice says (both must be unserved).</summary>
    public void Apply(int c, int d, in Choice choice)
    {
        var s = _state;
        var stops = s.Route(choice.Route);
        int count = 0;
        for (int k = 0; k <= stops.Length; k++)
        {
            if (k == choice.GapC)
            {
                _buffer[count++] = c;
            }

            if (k == choice.GapD)
            {
                _buffer[count++] = d;
            }

            if (k < stops.Length)
            {
                _buffer[count++] = stops[k];
            }
        }

        s.SetRoute(choice.Route, _buffer.AsSpan(0, count));
    }
}
