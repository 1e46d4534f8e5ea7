using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// The plan a search works on, as one front over its parts: the routes (<see cref="RouteStore"/>), their segment
/// summaries (<see cref="SegmentCache"/>), what they cost (<see cref="RouteCosts"/>) and the evaluation of drafted
/// moves (<see cref="MoveEvaluator"/>). Every change goes through here, so the parts never disagree.
/// </summary>
public sealed class SearchState
{
    private readonly RouteStore _store;
    private readonly SegmentCache _cache;
    private readonly RouteCosts _costs;
    private readonly MoveEvaluator _evaluator;
    private readonly int[] _scratch;
    private readonly int[] _scratchB;

    // The store's arrays, read directly by the accessors below: move sampling calls them in its hot loop.
    private readonly int[][] _stops;
    private readonly int[] _lengths;
    private readonly int[] _routeOf;
    private readonly int[] _positionOf;

    public SearchState(Instance instance, PenaltyWeights weights)
    {
        Instance = instance;
        StopCount = instance.StopCount;
        RouteCount = instance.Vehicles.Count;
        _store = new RouteStore(StopCount, RouteCount);
        _cache = new SegmentCache(instance, _store);
        _costs = new RouteCosts(instance, _store, weights);
        _evaluator = new MoveEvaluator(instance, _store, _cache, _costs);
        (_stops, _lengths, _routeOf, _positionOf) = (_store.Stops, _store.Lengths, _store.RouteOfStop, _store.PositionOfStop);
        _scratch = new int[StopCount + 1];
        _scratchB = new int[StopCount + 1];
        for (int i = 0; i < StopCount; i++)
        {
            _store.SetUnrouted(i);
            Unserve(i);
        }
    }

    public Instance Instance { get; }

    public int StopCount { get; }

    public int RouteCount { get; }

    /// <summary>Segment concatenation is exact here: hard single windows and at most four dimensions.</summary>
    public bool FastPath => _cache.FastPath;

    public PenaltyWeights Weights => _costs.Weights;

    public int RouteOf(int stop) => _routeOf[stop];

    /// <summary>Changes every time the route changes; lets a search cache move evaluations per route pair.</summary>
    public int Version(int route) => _store.Version(route);

    public int PositionOf(int stop) => _positionOf[stop];

    public int Length(int route) => _lengths[route];

    public int StopAt(int route, int position) => _stops[route][position];

    public ReadOnlySpan<int> Route(int route) => _stops[route].AsSpan(0, _lengths[route]);

    public int UnservedCount => _store.UnservedCount;

    public int UnservedAt(int index) => _store.UnservedAt(index);

    /// <summary>No hard rule broken: every route feasible and no mandatory stop unserved.</summary>
    public bool Feasible => _costs.InfeasibleRoutes == 0 && _costs.MandatoryUnserved == 0;

    /// <summary>Routes that break a hard rule now (unserved stops aside).</summary>
    public int InfeasibleRoutes => _costs.InfeasibleRoutes;

    /// <summary>The reported objective (no search penalties), kept by every change.</summary>
    public double Objective => _costs.Objective;

    /// <summary>The objective plus the hard-rule violations at the current prices, kept by every change.</summary>
    public double Penalized => _costs.Penalized;

    public int UsedRoutes
    {
        get
        {
            int used = 0;
            for (int r = 0; r < RouteCount; r++)
            {
                if (_store.Length(r) > 0)
                {
                    used++;
                }
            }

            return used;
        }
    }

    /// <summary>Total violation per hard rule over all routes (zero where the rule is soft).</summary>
    public RuleAmounts CurrentViolations() => _costs.Violations();

    public void SetWeights(in PenaltyWeights weights) => _costs.SetWeights(weights);

    /// <inheritdoc cref="MoveEvaluator.Evaluate"/>
    public MoveEffect Evaluate(ref MoveDraft move) => _evaluator.Evaluate(ref move);

    /// <inheritdoc cref="MoveEvaluator.EvaluateParts"/>
    public MoveParts EvaluateParts(ref MoveDraft move) => _evaluator.EvaluateParts(ref move);

    /// <inheritdoc cref="MoveEvaluator.FeasibleChange"/>
    public bool FeasibleChange(ref RouteDraft draft, out double objectiveChange) => _evaluator.FeasibleChange(ref draft, out objectiveChange);

    /// <inheritdoc cref="MoveEvaluator.FeasibleAfter(in MoveParts)"/>
    public bool FeasibleAfter(in MoveParts parts) => _evaluator.FeasibleAfter(parts);

    /// <inheritdoc cref="MoveEvaluator.OpensRoute"/>
    public bool OpensRoute(ref MoveDraft move) => _evaluator.OpensRoute(ref move);

    /// <inheritdoc cref="MoveEvaluator.EmptiesRoute"/>
    public bool EmptiesRoute(ref MoveDraft move) => _evaluator.EmptiesRoute(ref move);

    /// <inheritdoc cref="SegmentCache.Measure"/>
    public RouteMetrics Measure(ref RouteDraft draft) => _cache.Measure(ref draft);

    public void Apply(ref MoveDraft move)
    {
        // Read both drafts before writing either: they may take pieces from each other's routes.
        int countA = move.RouteCount > 0 ? _store.Materialise(ref move.A, _scratch) : 0;
        int countB = move.RouteCount > 1 ? _store.Materialise(ref move.B, _scratchB) : 0;
        if (move.Dropped >= 0)
        {
            _store.SetUnrouted(move.Dropped);
            Unserve(move.Dropped);
        }

        if (move.Inserted >= 0)
        {
            Serve(move.Inserted);
        }

        if (move.RouteCount > 0)
        {
            Store(move.A.Route, _scratch.AsSpan(0, countA));
        }

        if (move.RouteCount > 1)
        {
            Store(move.B.Route, _scratchB.AsSpan(0, countB));
        }
    }

    /// <summary>
    /// Gives a route exactly these stops, in order. Stops it loses go unserved; every stop given must be unserved
    /// or on this route already. For compound changes (ruin and recreate, and undoing one).
    /// </summary>
    public void SetRoute(int route, ReadOnlySpan<int> stops)
    {
        const int Leaving = -2;
        var old = _store.Route(route);
        for (int k = 0; k < old.Length; k++)
        {
            _store.SetUnrouted(old[k], Leaving);
        }

        for (int k = 0; k < stops.Length; k++)
        {
            int stop = stops[k];
            if (_store.RouteOf(stop) == -1)
            {
                Serve(stop);
            }
            else if (_store.RouteOf(stop) != Leaving)
            {
                throw new InvalidOperationException($"Stop {stop} is on route {_store.RouteOf(stop)}, not {route}.");
            }

            _store.SetUnrouted(stop, route);
        }

        for (int k = 0; k < old.Length; k++)
        {
            if (_store.RouteOf(old[k]) == Leaving)
            {
                _store.SetUnrouted(old[k]);
                Unserve(old[k]);
            }
        }

        stops.CopyTo(_scratch);
        Store(route, _scratch.AsSpan(0, stops.Length));
    }

    /// <summary>Replaces the whole plan.</summary>
    public void Load(Plan plan)
    {
        for (int r = 0; r < RouteCount; r++)
        {
            foreach (int s in _store.Route(r))
            {
                _store.SetUnrouted(s);
                Unserve(s);
            }

            Store(r, []);
        }

        foreach (var route in plan.Routes)
        {
            foreach (int s in route.Stops)
            {
                Serve(s);
            }

            Store(route.Vehicle, route.Stops);
        }
    }

    public Plan ToPlan()
    {
        var routes = new List<PlannedRoute>();
        for (int r = 0; r < RouteCount; r++)
        {
            if (_store.Length(r) > 0)
            {
                routes.Add(new PlannedRoute(r, _store.Route(r).ToArray()));
            }
        }

        return new Plan(routes);
    }

    /// <summary>Copies the routes into a flat snapshot (route lengths then stops) for cheap best-so-far keeping.</summary>
    public void CopyTo(int[] lengths, int[][] stops)
    {
        for (int r = 0; r < RouteCount; r++)
        {
            int length = _store.Length(r);
            lengths[r] = length;
            if (stops[r].Length < length)
            {
                stops[r] = new int[Math.Max(length, stops[r].Length * 2)];
            }

            _store.Route(r).CopyTo(stops[r]);
        }
    }

    /// <summary>A route's new stops: positions and version, segment summaries, then its costs.</summary>
    private void Store(int route, ReadOnlySpan<int> stops)
    {
        _store.Store(route, stops);
        _cache.Rebuild(route);
        _costs.Refresh(route, RouteScheduler.Measure(Instance, route, _store.Route(route)));
    }

    private void Unserve(int stop)
    {
        _store.AddUnserved(stop);
        _costs.Unserve(stop);
    }

    private void Serve(int stop)
    {
        _store.RemoveUnserved(stop);
        _costs.Serve(stop);
    }
}
