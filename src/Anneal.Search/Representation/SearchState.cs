using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// The solution a search works on: one route per vehicle (possibly empty), positions of every stop, the unserved
/// pool, per-route prefix and suffix segment summaries, and cached route costs under the current penalty weights.
/// </summary>
public sealed class SearchState
{
    public Instance Instance { get; }
    public int StopCount { get; }
    public int RouteCount { get; }

    /// <summary>Segment concatenation is exact here: hard single windows and at most four dimensions.</summary>
    public bool FastPath { get; }

    private readonly int[][] _stops;
    private readonly int[] _length;
    private readonly int[] _routeOf;
    private readonly int[] _posOf;
    private readonly Segment[][] _prefix;
    private readonly Segment[][] _suffix;

    // The same summaries with the route's own depots attached: start depot + stops 0..k, and stops k.. + end depot.
    // A move that keeps a route's head or tail then costs one concatenation less at each end.
    private readonly Segment[][] _head;
    private readonly Segment[][] _tail;
    private readonly Segment[] _node;
    private readonly Segment[] _depotStart;
    private readonly Segment[] _depotEnd;
    private readonly RouteMetrics[] _metrics;
    private readonly double[] _objective;
    private readonly double[] _penalized;
    private readonly bool[] _feasible;
    private readonly int[] _unserved;
    private readonly int[] _unservedIndex;
    private int _unservedCount;
    private double _totalObjective;
    private double _totalPenalized;
    private int _infeasibleRoutes;
    private int _mandatoryUnserved;
    private readonly int[] _scratch;
    private readonly int[] _version;
    private readonly int[] _scratchB;
    private PenaltyWeights _weights;
    private readonly CostTable _costs;

    public SearchState(Instance instance, PenaltyWeights weights)
    {
        Instance = instance;
        StopCount = instance.StopCount;
        RouteCount = instance.Vehicles.Count;
        _weights = weights;
        _costs = instance.Costs;
        FastPath = instance.Rules.TimeWindows.Hard && instance.SingleWindows && instance.DimensionCount <= 4;
        int n = StopCount;
        _stops = new int[RouteCount][];
        _prefix = new Segment[RouteCount][];
        _suffix = new Segment[RouteCount][];
        _head = new Segment[RouteCount][];
        _tail = new Segment[RouteCount][];
        _length = new int[RouteCount];
        for (int r = 0; r < RouteCount; r++)
        {
            _stops[r] = new int[8];
            _prefix[r] = new Segment[8];
            _suffix[r] = new Segment[8];
            _head[r] = new Segment[8];
            _tail[r] = new Segment[8];
        }

        _routeOf = new int[n];
        _posOf = new int[n];
        _unserved = new int[n];
        _unservedIndex = new int[n];
        _scratch = new int[n + 1];
        _scratchB = new int[n + 1];
        _metrics = new RouteMetrics[RouteCount];
        _version = new int[RouteCount];
        _objective = new double[RouteCount];
        _penalized = new double[RouteCount];
        _feasible = new bool[RouteCount];
        Array.Fill(_feasible, true);
        _node = new Segment[n];
        for (int i = 0; i < n; i++)
        {
            var hull = instance.Hull(i);
            _node[i] = Segment.Node(i, instance.ServiceTime(i), hull.Open, hull.Close,
                Dim(instance, i, 0), Dim(instance, i, 1), Dim(instance, i, 2), Dim(instance, i, 3), instance.Stops[i].Needs);
        }

        _depotStart = new Segment[RouteCount];
        _depotEnd = new Segment[RouteCount];
        for (int v = 0; v < RouteCount; v++)
        {
            var veh = instance.Vehicles[v];
            _depotStart[v] = Segment.Depot(instance.DepotLocation(veh.StartDepot), veh.ShiftStart, veh.ShiftEnd);
            _depotEnd[v] = Segment.Depot(instance.DepotLocation(veh.EndDepot), double.NegativeInfinity, double.PositiveInfinity);
        }

        for (int i = 0; i < n; i++)
        {
            _routeOf[i] = -1;
            AddUnserved(i);
        }
    }

    private static double Dim(Instance instance, int stop, int d) => d < instance.DimensionCount ? instance.Demand(stop, d) : 0;

    public PenaltyWeights Weights => _weights;

    public int RouteOf(int stop) => _routeOf[stop];

    /// <summary>Changes every time the route changes; lets a search cache move evaluations per route pair.</summary>
    public int Version(int route) => _version[route];
    public int PositionOf(int stop) => _posOf[stop];
    public int Length(int route) => _length[route];
    public int StopAt(int route, int position) => _stops[route][position];
    public ReadOnlySpan<int> Route(int route) => _stops[route].AsSpan(0, _length[route]);
    public int UnservedCount => _unservedCount;
    public int UnservedAt(int index) => _unserved[index];
    public double RoutePenalizedCost(int route) => _penalized[route];
    public ref readonly RouteMetrics Metrics(int route) => ref _metrics[route];

    /// <summary>No hard rule broken: every route feasible and no mandatory stop unserved.</summary>
    public bool Feasible => _infeasibleRoutes == 0 && _mandatoryUnserved == 0;

    /// <summary>Routes that break a hard rule now (unserved stops aside).</summary>
    public int InfeasibleRoutes => _infeasibleRoutes;

    /// <summary>Objective of one route as it is now.</summary>
    public double RouteObjective(int route) => _objective[route];

    /// <summary>The reported objective (no search penalties), summed afresh.</summary>
    public double Objective()
    {
        double total = 0;
        for (int r = 0; r < RouteCount; r++)
        {
            total += _objective[r];
        }

        for (int k = 0; k < _unservedCount; k++)
        {
            total += CostModel.UnservedObjective(Instance, _unserved[k]);
        }

        return total;
    }

    /// <summary>Objective plus weighted hard-rule violations, summed afresh.</summary>
    public double Penalized()
    {
        double total = 0;
        for (int r = 0; r < RouteCount; r++)
        {
            total += _penalized[r];
        }

        for (int k = 0; k < _unservedCount; k++)
        {
            total += UnservedCost(_unserved[k]);
        }

        return total;
    }

    public double UnservedCost(int stop) => CostModel.UnservedObjective(Instance, stop) + CostModel.UnservedViolation(Instance, stop, _weights);

    public int UsedRoutes
    {
        get
        {
            int used = 0;
            for (int r = 0; r < RouteCount; r++)
            {
                if (_length[r] > 0)
                {
                    used++;
                }
            }

            return used;
        }
    }

    /// <summary>Total violation per hard rule over all routes (zero where the rule is soft).</summary>
    public RuleAmounts CurrentViolations()
    {
        var rules = Instance.Rules;
        var v = default(RuleAmounts);
        for (int r = 0; r < RouteCount; r++)
        {
            if (_feasible[r])
            {
                continue;
            }

            ref readonly var m = ref _metrics[r];
            v.TimeWindow += rules.TimeWindows.Hard ? m.TimeWindowViolation : 0;
            v.Capacity += rules.Capacity.Hard ? m.Overload : 0;
            v.Overtime += rules.ShiftEnd.Hard ? m.Overtime : 0;
            v.Duration += rules.MaxDuration.Hard ? m.DurationExcess : 0;
            v.Equipment += m.MissingEquipment;
        }

        v.Unserved = _mandatoryUnserved;
        return v;
    }

    /// <summary>Running total of the objective (kept by every change; re-summed when weights change).</summary>
    public double CurrentObjective => _totalObjective;

    /// <summary>Running total of the penalized cost.</summary>
    public double CurrentPenalized => _totalPenalized;

    public void SetWeights(in PenaltyWeights weights)
    {
        _weights = weights;
        for (int r = 0; r < RouteCount; r++)
        {
            _penalized[r] = CostModel.RoutePenalized(Instance, r, _metrics[r], _weights);
        }

        _totalObjective = Objective();
        _totalPenalized = Penalized();
    }

    /// <summary>Would the plan break no hard rule after this move? Uses the measures <see cref="Evaluate"/> computed.</summary>
    private bool FeasibleAfter(ref MoveDraft move, bool feasibleA, bool feasibleB)
    {
        int infeasible = _infeasibleRoutes;
        if (move.RouteCount > 0)
        {
            infeasible += (feasibleA ? 0 : 1) - (_feasible[move.A.Route] ? 0 : 1);
        }

        if (move.RouteCount > 1)
        {
            infeasible += (feasibleB ? 0 : 1) - (_feasible[move.B.Route] ? 0 : 1);
        }

        int mandatory = _mandatoryUnserved;
        if (move.Dropped >= 0 && !Instance.MayDrop(move.Dropped))
        {
            mandatory++;
        }

        if (move.Inserted >= 0 && !Instance.MayDrop(move.Inserted))
        {
            mandatory--;
        }

        return infeasible == 0 && mandatory == 0;
    }

    /// <summary>Does the move put stops on a route that has none now?</summary>
    public bool OpensRoute(ref MoveDraft move) =>
        (move.RouteCount > 0 && move.A.Count > 0 && _length[move.A.Route] == 0)
        || (move.RouteCount > 1 && move.B.Count > 0 && _length[move.B.Route] == 0);

    /// <summary>Does the move take the last stops off a route?</summary>
    public bool EmptiesRoute(ref MoveDraft move) =>
        (move.RouteCount > 0 && move.A.Count == 0 && _length[move.A.Route] > 0)
        || (move.RouteCount > 1 && move.B.Count == 0 && _length[move.B.Route] > 0);

    /// <summary>Feasibility after a move whose parts were computed earlier, against the state as it is now.</summary>
    public bool FeasibleAfter(in MoveParts parts) =>
        _infeasibleRoutes + parts.InfeasibleRoutes == 0 && _mandatoryUnserved + parts.Violation.Unserved == 0;

    /// <summary>The move's effect split by rule (see <see cref="MoveParts"/>).</summary>
    public MoveParts EvaluateParts(ref MoveDraft move)
    {
        var parts = default(MoveParts);
        bool feasibleA = true, feasibleB = true;
        if (move.RouteCount > 0)
        {
            feasibleA = AddRouteParts(ref move.A, ref parts);
        }

        if (move.RouteCount > 1)
        {
            feasibleB = AddRouteParts(ref move.B, ref parts);
        }

        if (move.Dropped >= 0)
        {
            parts.Objective += CostModel.UnservedObjective(Instance, move.Dropped);
            parts.Violation.Unserved += Instance.MayDrop(move.Dropped) ? 0 : 1;
        }

        if (move.Inserted >= 0)
        {
            parts.Objective -= CostModel.UnservedObjective(Instance, move.Inserted);
            parts.Violation.Unserved -= Instance.MayDrop(move.Inserted) ? 0 : 1;
        }

        parts.FeasibleAfter = FeasibleAfter(ref move, feasibleA, feasibleB);
        parts.EmptiesRoute = EmptiesRoute(ref move);
        parts.OpensRoute = OpensRoute(ref move);
        if (move.RouteCount > 0)
        {
            parts.InfeasibleRoutes += (feasibleA ? 0 : 1) - (_feasible[move.A.Route] ? 0 : 1);
        }

        if (move.RouteCount > 1)
        {
            parts.InfeasibleRoutes += (feasibleB ? 0 : 1) - (_feasible[move.B.Route] ? 0 : 1);
        }

        return parts;
    }

    private bool AddRouteParts(ref RouteDraft draft, ref MoveParts parts)
    {
        var m = Measure(ref draft);
        ref readonly var old = ref _metrics[draft.Route];
        var rules = Instance.Rules;
        parts.Objective += CostModel.RouteObjective(Instance, draft.Route, m) - _objective[draft.Route];
        if (rules.TimeWindows.Hard)
        {
            parts.Violation.TimeWindow += Amount(m.TimeWindowViolation, m) - Amount(old.TimeWindowViolation, old);
        }

        if (rules.Capacity.Hard)
        {
            parts.Violation.Capacity += Amount(m.Overload, m) - Amount(old.Overload, old);
        }

        if (rules.ShiftEnd.Hard)
        {
            parts.Violation.Overtime += Amount(m.Overtime, m) - Amount(old.Overtime, old);
        }

        if (rules.MaxDuration.Hard)
        {
            parts.Violation.Duration += Amount(m.DurationExcess, m) - Amount(old.DurationExcess, old);
        }

        parts.Violation.Equipment += Amount(m.MissingEquipment, m) - Amount(old.MissingEquipment, old);
        return CostModel.RouteFeasible(Instance, m);
    }

    // An empty route breaks nothing, whatever its measures say.
    private static double Amount(double value, in RouteMetrics m) => m.StopCount == 0 ? 0 : value;

    /// <summary>Full effect of a move: penalized and objective change, and feasibility afterwards.</summary>
    public MoveEffect Evaluate(ref MoveDraft move)
    {
        var effect = default(MoveEffect);
        bool feasibleA = true, feasibleB = true;
        if (move.RouteCount > 0)
        {
            feasibleA = AddRouteEffect(ref move.A, ref effect);
        }

        if (move.RouteCount > 1)
        {
            feasibleB = AddRouteEffect(ref move.B, ref effect);
        }

        if (move.Dropped >= 0)
        {
            effect.Penalized += UnservedCost(move.Dropped);
            effect.Objective += CostModel.UnservedObjective(Instance, move.Dropped);
        }

        if (move.Inserted >= 0)
        {
            effect.Penalized -= UnservedCost(move.Inserted);
            effect.Objective -= CostModel.UnservedObjective(Instance, move.Inserted);
        }

        effect.FeasibleAfter = FeasibleAfter(ref move, feasibleA, feasibleB);
        return effect;
    }

    /// <summary>Adds one new route's cost change to the effect; returns whether that route breaks no hard rule.</summary>
    private bool AddRouteEffect(ref RouteDraft draft, ref MoveEffect effect)
    {
        var m = Measure(ref draft);
        double objective = CostModel.RouteObjective(Instance, draft.Route, m);
        effect.Objective += objective - _objective[draft.Route];
        effect.Penalized += objective + CostModel.RouteViolation(Instance, m, _weights) - _penalized[draft.Route];
        return CostModel.RouteFeasible(Instance, m);
    }

    public void Load(Plan plan)
    {
        for (int r = 0; r < RouteCount; r++)
        {
            for (int k = 0; k < _length[r]; k++)
            {
                int s = _stops[r][k];
                _routeOf[s] = -1;
                AddUnserved(s);
            }

            _length[r] = 0;
            Refresh(r);
        }

        foreach (var route in plan.Routes)
        {
            var target = route.Stops;
            EnsureCapacity(route.Vehicle, target.Length);
            for (int k = 0; k < target.Length; k++)
            {
                RemoveUnserved(target[k]);
                _stops[route.Vehicle][k] = target[k];
            }

            _length[route.Vehicle] = target.Length;
            Refresh(route.Vehicle);
        }
    }

    public Plan ToPlan()
    {
        var routes = new List<PlannedRoute>();
        for (int r = 0; r < RouteCount; r++)
        {
            if (_length[r] > 0)
            {
                routes.Add(new PlannedRoute(r, _stops[r].AsSpan(0, _length[r]).ToArray()));
            }
        }

        return new Plan(routes);
    }

    /// <summary>Copies the routes into a flat snapshot (route lengths then stops) for cheap best-so-far keeping.</summary>
    public void CopyTo(int[] lengths, int[][] stops)
    {
        for (int r = 0; r < RouteCount; r++)
        {
            lengths[r] = _length[r];
            if (stops[r].Length < _length[r])
            {
                stops[r] = new int[Math.Max(_length[r], stops[r].Length * 2)];
            }

            Array.Copy(_stops[r], stops[r], _length[r]);
        }
    }

    /// <summary>Penalized cost change if the move were applied (cost of new routes − old routes ± unserved).</summary>
    public double Delta(ref MoveDraft move) => Evaluate(ref move).Penalized;

    /// <summary>Penalized cost of the route a draft describes, and its measures.</summary>
    public double MeasureDraft(ref RouteDraft draft, out RouteMetrics metrics)
    {
        metrics = Measure(ref draft);
        return CostModel.RoutePenalized(Instance, draft.Route, metrics, _weights);
    }

    /// <summary>Objective change of the route a draft describes, when that route keeps to the hard rules.</summary>
    public bool FeasibleChange(ref RouteDraft draft, out double objectiveChange)
    {
        var m = Measure(ref draft);
        if (!CostModel.RouteFeasible(Instance, m))
        {
            objectiveChange = 0;
            return false;
        }

        objectiveChange = CostModel.RouteObjective(Instance, draft.Route, m) - _objective[draft.Route];
        return true;
    }

    private RouteMetrics Measure(ref RouteDraft draft) => FastPath ? MeasureBySegments(ref draft) : MeasureByScheduler(ref draft);

    private RouteMetrics MeasureByScheduler(ref RouteDraft draft)
    {
        int count = Materialise(ref draft, _scratch);
        return RouteScheduler.Measure(Instance, draft.Route, _scratch.AsSpan(0, count));
    }

    private RouteMetrics MeasureBySegments(ref RouteDraft draft)
    {
        var travel = Instance.Travel;
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
        m.Overload = Overload(vehicle, in acc);
        m.MissingEquipment = System.Numerics.BitOperations.PopCount(acc.Needs & ~costs.Equipment(vehicle));
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

    private double Overload(int vehicle, in Segment s)
    {
        int dims = Instance.DimensionCount;
        double over = Math.Max(0, s.Load0 - Instance.Capacity(vehicle, 0));
        if (dims > 1)
        {
            over += Math.Max(0, s.Load1 - Instance.Capacity(vehicle, 1));
        }

        if (dims > 2)
        {
            over += Math.Max(0, s.Load2 - Instance.Capacity(vehicle, 2));
        }

        if (dims > 3)
        {
            over += Math.Max(0, s.Load3 - Instance.Capacity(vehicle, 3));
        }

        return over;
    }

    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private static void Append(ref Segment acc, in Segment next, Core.Travel.TravelTable travel)
    {
        travel.Arc(acc.Last, next.First, out double distance, out double duration);
        Segment.Extend(ref acc, in next, duration, distance);
    }

    /// <summary>Writes the draft's stops, in order, into <paramref name="target"/>; returns the count.</summary>
    private int Materialise(ref RouteDraft draft, int[] target)
    {
        int count = 0;
        for (int k = 0; k < draft.Count; k++)
        {
            ref Piece p = ref draft.Pieces[k];
            if (p.Route < 0)
            {
                target[count++] = p.Stop;
                continue;
            }

            var stops = _stops[p.Route];
            if (!p.Reversed)
            {
                for (int i = p.From; i <= p.To; i++)
                {
                    target[count++] = stops[i];
                }
            }
            else
            {
                for (int i = p.To; i >= p.From; i--)
                {
                    target[count++] = stops[i];
                }
            }
        }

        return count;
    }

    public void Apply(ref MoveDraft move)
    {
        // Read both drafts before writing either: they may take pieces from each other's routes.
        int countA = move.RouteCount > 0 ? Materialise(ref move.A, _scratch) : 0;
        int countB = move.RouteCount > 1 ? Materialise(ref move.B, _scratchB) : 0;
        if (move.Dropped >= 0)
        {
            _routeOf[move.Dropped] = -1;
            AddUnserved(move.Dropped);
        }

        if (move.Inserted >= 0)
        {
            RemoveUnserved(move.Inserted);
        }

        if (move.RouteCount > 0)
        {
            Store(move.A.Route, _scratch, countA);
        }

        if (move.RouteCount > 1)
        {
            Store(move.B.Route, _scratchB, countB);
        }
    }

    /// <summary>
    /// Gives a route exactly these stops, in order. Stops it loses go unserved; every stop given must be unserved
    /// or on this route already. For compound changes (ruin and recreate, and undoing one).
    /// </summary>
    public void SetRoute(int route, ReadOnlySpan<int> stops)
    {
        const int Leaving = -2;
        var old = _stops[route];
        int len = _length[route];
        for (int k = 0; k < len; k++)
        {
            _routeOf[old[k]] = Leaving;
        }

        for (int k = 0; k < stops.Length; k++)
        {
            int stop = stops[k];
            if (_routeOf[stop] == -1)
            {
                RemoveUnserved(stop);
            }
            else if (_routeOf[stop] != Leaving)
            {
                throw new InvalidOperationException($"Stop {stop} is on route {_routeOf[stop]}, not {route}.");
            }

            _routeOf[stop] = route;
        }

        for (int k = 0; k < len; k++)
        {
            if (_routeOf[old[k]] == Leaving)
            {
                _routeOf[old[k]] = -1;
                AddUnserved(old[k]);
            }
        }

        stops.CopyTo(_scratch);
        Store(route, _scratch, stops.Length);
    }

    private void Store(int route, int[] source, int count)
    {
        EnsureCapacity(route, count);
        Array.Copy(source, _stops[route], count);
        _length[route] = count;
        Refresh(route);
    }

    private void EnsureCapacity(int route, int count)
    {
        if (_stops[route].Length < count)
        {
            int size = Math.Max(count, _stops[route].Length * 2);
            Array.Resize(ref _stops[route], size);
            _prefix[route] = new Segment[size];
            _suffix[route] = new Segment[size];
            _head[route] = new Segment[size];
            _tail[route] = new Segment[size];
        }
    }

    /// <summary>Recomputes positions, summaries, measures and costs of one route after it changed.</summary>
    private void Refresh(int route)
    {
        _version[route]++;
        var stops = _stops[route];
        int len = _length[route];
        for (int k = 0; k < len; k++)
        {
            _routeOf[stops[k]] = route;
            _posOf[stops[k]] = k;
        }

        if (FastPath && len > 0)
        {
            var travel = Instance.Travel;
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
        }

        bool wasFeasible = _feasible[route];
        var m = RouteScheduler.Measure(Instance, route, stops.AsSpan(0, len));
        _metrics[route] = m;
        _totalObjective -= _objective[route];
        _totalPenalized -= _penalized[route];
        _objective[route] = CostModel.RouteObjective(Instance, route, m);
        _penalized[route] = CostModel.RoutePenalized(Instance, route, m, _weights);
        _totalObjective += _objective[route];
        _totalPenalized += _penalized[route];
        _feasible[route] = CostModel.RouteFeasible(Instance, m);
        if (wasFeasible != _feasible[route])
        {
            _infeasibleRoutes += _feasible[route] ? -1 : 1;
        }
    }

    private void AddUnserved(int stop)
    {
        _unservedIndex[stop] = _unservedCount;
        _unserved[_unservedCount++] = stop;
        _totalObjective += CostModel.UnservedObjective(Instance, stop);
        _totalPenalized += UnservedCost(stop);
        if (!Instance.MayDrop(stop))
        {
            _mandatoryUnserved++;
        }
    }

    private void RemoveUnserved(int stop)
    {
        int idx = _unservedIndex[stop];
        int last = _unserved[--_unservedCount];
        _unserved[idx] = last;
        _unservedIndex[last] = idx;
        _totalObjective -= CostModel.UnservedObjective(Instance, stop);
        _totalPenalized -= UnservedCost(stop);
        if (!Instance.MayDrop(stop))
        {
            _mandatoryUnserved--;
        }
    }
}
