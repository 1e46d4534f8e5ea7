using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Route minimisation by an ejection pool (after Nagata &amp; Bräysy 2009): a route is emptied into a pool, and
/// the pool's stops go back one at a time while every route keeps to the hard rules. A stop that fits nowhere
/// takes the place of one or two stops of a route, chosen so that the stops ejected have been ejected least often
/// so far (each stop's pressure counts how often it could not be placed); random feasible moves between
/// ejections keep the search from cycling. Succeeds when the pool is empty: the plan has one route fewer.
/// </summary>
public sealed class EjectionPool
{
    private readonly SearchState _state;
    private readonly CandidateLists _candidates;
    private readonly SearchRandom _rng;
    private readonly MoveSampler _sampler;
    private readonly int[] _pressure;
    private readonly int[] _pool;
    private int _poolCount;
    private RouteDraft _draft;
    private MoveDraft _move;
    private readonly PairInsertion? _pairs;

    /// <summary>Random feasible moves tried after each ejection.</summary>
    public const int Shakes = 100;

    public EjectionPool(SearchState state, CandidateLists candidates, SearchRandom rng)
    {
        _state = state;
        _candidates = candidates;
        _rng = rng;
        _sampler = new MoveSampler(state, candidates, rng);
        _pressure = new int[state.StopCount];
        _pool = new int[state.StopCount];
        _pairs = state.Instance.HasPairs ? new PairInsertion(state) : null;
    }

    /// <summary>Stops waiting in the pool.</summary>
    public int Waiting => _poolCount;

    /// <summary>
    /// Empties <paramref name="route"/> into the pool; the state's other routes must keep to the hard rules.
    /// Pressures start afresh for each route removed.
    /// </summary>
    public void Begin(int route)
    {
        Array.Fill(_pressure, 1);
        _poolCount = 0;
        var s = _state;
        while (s.Length(route) > 0)
        {
            int stop = s.StopAt(route, s.Length(route) - 1);
            MoveBuilder.Drop(s, ref _move, stop);
            s.Apply(ref _move);
            _pool[_poolCount++] = stop;
        }

        // The emptied route's order would otherwise decide the order of reinsertion.
        for (int k = _poolCount - 1; k > 0; k--)
        {
            int j = _rng.Next(k + 1);
            (_pool[k], _pool[j]) = (_pool[j], _pool[k]);
        }
    }

    /// <summary>
    /// Places the last stop of the pool, ejecting others if it fits nowhere. Returns the work done, in route
    /// evaluations, so that callers can count it against an iteration budget.
    /// </summary>
    public long Step()
    {
        if (_poolCount == 0)
        {
            return 0;
        }

        long work = 0;
        int stop = _pool[--_poolCount];
        if (_pairs is not null && TakePartner(stop) is int partner and >= 0)
        {
            return StepPair(stop, partner);
        }

        if (InsertFeasibly(stop, ref work))
        {
            return work;
        }

        _pressure[stop]++;
        if (!EjectFor(stop, ref work))
        {
            // Nothing can make room for it now; it waits at the bottom of the pool for the routes to change.
            Array.Copy(_pool, 0, _pool, 1, _poolCount);
            _pool[0] = stop;
            _poolCount++;
        }

        work += Shake();
        return work;
    }

    /// <summary>Takes the stop's partner out of the pool when it waits there; returns it, or -1.</summary>
    private int TakePartner(int stop)
    {
        int partner = _state.Instance.Partner(stop);
        for (int k = 0; partner >= 0 && k < _poolCount; k++)
        {
            if (_pool[k] == partner)
            {
                Array.Copy(_pool, k + 1, _pool, k, _poolCount - k - 1);
                _poolCount--;
                return partner;
            }
        }

        return -1;
    }

    /// <summary>
    /// A pair from the pool at its cheapest feasible positions on a route of a neighbour of either end; when it fits
    /// nowhere it waits at the bottom of the pool (pairs eject no other stops yet) and random moves change the routes.
    /// </summary>
    private long StepPair(int stop, int partner)
    {
        var s = _state;
        var instance = s.Instance;
        int c = instance.IsCollection(stop) ? stop : partner;
        int d = instance.Partner(c);
        var best = PairInsertion.Choice.None;
        long work = _pairs!.ScanNear(c, d, _candidates, feasibleOnly: true, ref best);
        if (best.Route >= 0)
        {
            _pairs!.Apply(c, d, best);
            return work;
        }

        _pressure[c]++;
        Array.Copy(_pool, 0, _pool, 2, _poolCount);
        _pool[0] = c;
        _pool[1] = d;
        _poolCount += 2;
        return work + Shake();
    }

    /// <summary>Cheapest feasible insertion next to one of the stop's candidate neighbours.</summary>
    private bool InsertFeasibly(int stop, ref long work)
    {
        var s = _state;
        double best = double.PositiveInfinity;
        int bestAnchor = -1;
        bool bestAfter = false;
        for (int k = 0; k < _candidates.K; k++)
        {
            int w = _candidates.At(stop, k);
            if (s.RouteOf(w) < 0)
            {
                continue;
            }

            for (int side = 0; side < 2; side++)
            {
                bool after = side == 1;
                MoveBuilder.Insert(s, ref _move, stop, w, after);
                work++;
                if (_state.FeasibleChange(ref _move.A, out double cost) && cost < best)
                {
                    best = cost;
                    bestAnchor = w;
                    bestAfter = after;
                }
            }
        }

        if (bestAnchor < 0)
        {
            return false;
        }

        MoveBuilder.Insert(s, ref _move, stop, bestAnchor, bestAfter);
        s.Apply(ref _move);
        return true;
    }

    /// <summary>
    /// Puts the stop next to one of its neighbours in place of one or two stops of that route, the pair with the
    /// least total pressure (then the cheapest); the ejected stops join the pool.
    /// </summary>
    private bool EjectFor(int stop, ref long work)
    {
        var s = _state;
        int bestPressure = int.MaxValue;
        double bestCost = double.PositiveInfinity;
        int bestRoute = -1, bestGap = -1, bestA = -1, bestB = -1;
        for (int k = 0; k < _candidates.K; k++)
        {
            int w = _candidates.At(stop, k);
            int r = s.RouteOf(w);
            if (r < 0)
            {
                continue;
            }

            for (int side = 0; side < 2; side++)
            {
                int gap = s.PositionOf(w) + side;
                int len = s.Length(r);
                for (int a = 0; a < len; a++)
                {
                    int pa = _pressure[s.StopAt(r, a)];
                    if (pa > bestPressure)
                    {
                        continue;
                    }

                    work++;
                    Build(r, gap, stop, a, -1);
                    if (_state.FeasibleChange(ref _draft, out double single) && (pa < bestPressure || single < bestCost))
                    {
                        (bestPressure, bestCost, bestRoute, bestGap, bestA, bestB) = (pa, single, r, gap, a, -1);
                    }

                    for (int b = a + 1; b < len; b++)
                    {
                        int pab = pa + _pressure[s.StopAt(r, b)];
                        if (pab > bestPressure)
                        {
                            continue;
                        }

                        work++;
                        Build(r, gap, stop, a, b);
                        if (_state.FeasibleChange(ref _draft, out double cost) && (pab < bestPressure || cost < bestCost))
                        {
                            (bestPressure, bestCost, bestRoute, bestGap, bestA, bestB) = (pab, cost, r, gap, a, b);
                        }
                    }
                }
            }
        }

        if (bestRoute < 0)
        {
            return false;
        }

        if (bestB >= 0)
        {
            // A move sends one stop to the pool: the second goes first, by a drop that shifts the later positions.
            int second = s.StopAt(bestRoute, bestB);
            MoveBuilder.Drop(s, ref _move, second);
            s.Apply(ref _move);
            _pool[_poolCount++] = second;
            bestGap -= bestGap > bestB ? 1 : 0;
        }

        int first = s.StopAt(bestRoute, bestA);
        Build(bestRoute, bestGap, stop, bestA, -1);
        _move.Reset(MoveKind.Insert);
        _move.RouteCount = 1;
        _move.A = _draft;
        _move.Inserted = stop;
        _move.Dropped = first;
        s.Apply(ref _move);
        _pool[_poolCount++] = first;
        return true;
    }

    /// <summary>Route r with <paramref name="stop"/> inserted before position <paramref name="gap"/> and positions a (and b) left out.</summary>
    private void Build(int r, int gap, int stop, int a, int b)
    {
        _draft.Clear(r);
        int from = 0;
        int len = _state.Length(r);
        bool inserted = false;
        for (int k = 0; k < 2; k++)
        {
            int cut = k == 0 ? a : b;
            if (cut < 0)
            {
                break;
            }

            if (!inserted && gap <= cut)
            {
                _draft.Add(Piece.Range(r, from, gap - 1));
                _draft.Add(Piece.Single(stop));
                from = gap;
                inserted = true;
            }

            _draft.Add(Piece.Range(r, from, cut - 1));
            from = cut + 1;
        }

        if (!inserted)
        {
            _draft.Add(Piece.Range(r, from, gap - 1));
            _draft.Add(Piece.Single(stop));
            from = Math.Max(from, gap);
        }

        _draft.Add(Piece.Range(r, from, len - 1));
    }

    /// <summary>Random moves between routes, each kept only if every route still keeps to the hard rules.</summary>
    private long Shake()
    {
        var s = _state;
        long work = 0;
        for (int k = 0; k < Shakes; k++)
        {
            if (!_sampler.Next(ref _move) || _move.Inserted >= 0 || _move.Dropped >= 0 || s.OpensRoute(ref _move))
            {
                continue;
            }

            work++;
            var parts = s.EvaluateParts(ref _move);
            if (s.InfeasibleRoutes + parts.InfeasibleRoutes == 0)
            {
                s.Apply(ref _move);
            }
        }

        return work;
    }
}
