using Anneal.Core.Model;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;
using Anneal.Core.Solving;
using Anneal.Search.Running;
using Anneal.Search.Strategy;

namespace Anneal.Search.Tabu;

/// <summary>
/// Tabu search after the unified tabu search of Cordeau, Laporte &amp; Mercier (2001): each iteration takes the best
/// admissible move of the granular neighbourhood; attributes (stop, route) are tabu for a randomised tenure;
/// aspiration by best cost; hard-rule prices adapt by (1 + delta) each iteration; non-improving moves pay for
/// attributes used often (diversification). Move evaluations are cached per stop pair and recomputed only when one
/// of the two routes changed, split by rule so that changing prices needs no re-evaluation.
/// </summary>
public sealed class TabuSearch : SeededSearch
{
    private const int Kinds = 5;
    private readonly TabuSettings _settings;

    public TabuSearch(TabuSettings? settings = null)
    {
        _settings = settings ?? new TabuSettings();
    }

    public override string Name => "tabu";

    public override string? Declines(Instance instance) => PickupSupport.Declines(instance);

    protected override SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var start = SearchStart.Begin(instance, options, _settings.Neighbours, progress, cancel);
        var run = new Run(this, start, new SearchRandom(options.Seed));
        run.Loop(options.TargetObjective);
        var budget = start.Budget;
        return new SolverResult(Name, run.Keeper.BestPlan(start.State), budget.Elapsed, start.Trace.SecondsToBest, start.Trace.Points, budget.StopReason);
    }

    /// <summary>The mutable state of one tabu run.</summary>
    private sealed class Run
    {
        private readonly TabuSettings _settings;
        private readonly Instance _instance;
        private readonly SearchState _state;
        private readonly CandidateLists _candidates;
        private readonly SearchRandom _rng;
        private readonly Budget _budget;
        private readonly TraceRecorder _trace;
        private readonly PenaltyAdapter _adapter;
        private readonly int _n;
        private readonly int _k;
        private readonly int _columns;

        // Cache per (stop, neighbour index): the routes and their versions the parts were computed for.
        private readonly int[] _cacheRouteU;
        private readonly int[] _cacheRouteV;
        private readonly int[] _cacheVersionU;
        private readonly int[] _cacheVersionV;
        private readonly MoveParts[] _parts;
        private readonly bool[] _valid;

        // Per stop: to an empty route (kind 0) or out of every route (kind 1), or into an empty route when unserved.
        private readonly MoveParts[] _soloParts;
        private readonly bool[] _soloValid;
        private readonly int[] _soloRoute;
        private readonly int[] _soloVersion;
        private readonly int[] _soloTarget;

        private readonly int[] _tabuUntil;
        private readonly int[] _frequency;
        private readonly double _tenure;
        private int _window;
        private int _chosenU;
        private int _chosenV;
        private readonly FleetPhase _phase;
        private readonly SearchStart _start;

        public BestKeeper Keeper { get; }

        public Run(TabuSearch owner, SearchStart start, SearchRandom rng)
        {
            var state = start.State;
            var instance = state.Instance;
            _settings = owner._settings;
            _instance = instance;
            _state = state;
            _candidates = start.Candidates;
            _rng = rng;
            _budget = start.Budget;
            _trace = start.Trace;
            _start = start;
            _n = state.StopCount;
            _k = _candidates.K;
            _columns = state.RouteCount + 1;
            _adapter = start.Prices(_settings.PenaltyDelta);
            Keeper = new BestKeeper(state);
            int pairs = _n * _k;
            _cacheRouteU = new int[pairs];
            _cacheRouteV = new int[pairs];
            _cacheVersionU = new int[pairs];
            _cacheVersionV = new int[pairs];
            Array.Fill(_cacheVersionU, -1);
            _parts = new MoveParts[pairs * Kinds];
            _valid = new bool[pairs * Kinds];
            _soloParts = new MoveParts[_n * 2];
            _soloValid = new bool[_n * 2];
            _soloRoute = new int[_n];
            _soloVersion = new int[_n];
            Array.Fill(_soloVersion, -1);
            _soloTarget = new int[_n];
            _tabuUntil = new int[_n * _columns];
            _frequency = new int[_n * _columns];
            _tenure = _settings.TenureFactor * Math.Log10(Math.Max(10, _n));
            _phase = new FleetPhase(RouteElimination.Applies(instance), _settings.FleetShare, _settings.FleetPatience);
        }

        public void Loop(double? target)
        {
            _trace.Improved(Point(0, "construction"));
            var move = default(MoveDraft);
            FleetSqueeze.Opening(_start, Keeper, _phase, _rng, _settings.SqueezeShare, _settings.SqueezePatience, WorkPerIteration, out long squeezed);
            int iteration = (int)squeezed;
            double lastImprovedAt = _budget.Progress(iteration);
            while (!_budget.Exhausted(iteration) && _n > 0)
            {
                iteration++;
                if (!SelectBest(iteration, ref move, out var parts))
                {
                    break;
                }

                var effect = parts.Effect(_state.Weights);
                effect.FeasibleAfter = _state.FeasibleAfter(parts);
                Keeper.BeforeApply(_state, effect);
                MarkTabu(ref move, iteration);
                if (move.RouteCount == 1 && move.Inserted < 0 && move.Dropped < 0)
                {
                    MarkIntraRoute(_chosenU, _chosenV, move.A.Route, iteration);
                }

                _state.Apply(ref move);
                if (Keeper.Offer(_state))
                {
                    lastImprovedAt = _budget.Progress(iteration);
                    _phase.NewBest(_state, lastImprovedAt);
                    _trace.Improved(Point(iteration, $"tenure={_tenure:0.#}"));
                    if (target is { } t && Keeper.HasFeasible && Keeper.Objective <= t)
                    {
                        _budget.ReachTarget();
                        break;
                    }
                }

                _adapter.Update(_state);
                double p = _budget.Progress(iteration);
                double stagnation = _phase.Eliminating ? _settings.StagnationFraction / 2 : _settings.StagnationFraction;
                bool repaired = false;
                if (_phase.Due(p))
                {
                    repaired = Restart.Settle(_state, Keeper, _adapter, _candidates, _rng);
                    iteration = (int)FleetSqueeze.Run(_start, Keeper, _phase, _rng, iteration, _settings.SqueezeShare / 4, _settings.SqueezePatience, WorkPerIteration);
                    _phase.BeginDistance(p = _budget.Progress(iteration));
                    Array.Clear(_tabuUntil);
                    lastImprovedAt = p;
                }
                else if (p - lastImprovedAt > stagnation && p < 0.9)
                {
                    repaired = Restart.AfterStall(_state, Keeper, _adapter, _candidates, _phase, p, _rng);
                    Array.Clear(_tabuUntil);
                    lastImprovedAt = p;
                }

                if (repaired)
                {
                    _trace.Improved(Point(iteration, "repaired"));
                }

                int it = iteration;
                _trace.Sample(_budget.Elapsed, () => Point(it, $"tenure={_tenure:0.#}"));
            }

            _trace.Finish(Point(iteration, $"tenure={_tenure:0.#}"));
        }

        // Route evaluations the ejection pool counts as one tabu iteration: about what a neighbourhood scan costs.
        private long WorkPerIteration => Math.Max(1, (long)Math.Min(_n, _settings.MaxStopsPerIteration) * _k);

        private TracePoint Point(long iteration, string note) =>
            new(_budget.Elapsed, iteration, Keeper.Objective, _state.Objective, Keeper.HasFeasible, note);

        private bool SelectBest(int iteration, ref MoveDraft move, out MoveParts bestParts)
        {
            var w = _state.Weights;
            double current = _state.Objective;
            double bestObjective = Keeper.HasFeasible ? Keeper.Objective : double.PositiveInfinity;
            double diversification = DiversificationScale(iteration);
            bool holdFleet = _phase.HoldsFleet && Keeper.HasFeasible;
            double bestScore = double.PositiveInfinity;
            int bestU = -1, bestJ = -1, bestKind = -1;
            bestParts = default;
            int scan = Math.Min(_n, _settings.MaxStopsPerIteration);
            int start = _n > scan ? _window : 0;
            _window = (_window + scan) % Math.Max(1, _n);
            for (int step = 0; step < scan; step++)
            {
                int u = (start + step) % _n;
                int ru = _state.RouteOf(u);
                for (int j = 0; j < _k; j++)
                {
                    int slot = (u * _k) + j;
                    int v = _candidates.At(u, j);
                    Refresh(slot, u, v);
                    for (int kind = 0; kind < Kinds; kind++)
                    {
                        int index = (slot * Kinds) + kind;
                        if (!_valid[index])
                        {
                            continue;
                        }

                        ref readonly var parts = ref _parts[index];
                        bool feasibleAfter = _state.FeasibleAfter(parts);
                        if (holdFleet && FleetPhase.Refuses(parts.OpensRoute, parts.EmptiesRoute, feasibleAfter, parts.Objective))
                        {
                            continue;
                        }

                        double pen = parts.Penalized(w);
                        bool aspires = feasibleAfter && current + parts.Objective < bestObjective - 1e-9;
                        if (!aspires && IsTabu(u, v, ru, _state.RouteOf(v), kind, iteration))
                        {
                            continue;
                        }

                        double score = pen;
                        if (pen >= 0 && !aspires)
                        {
                            score += diversification * Frequency(u, v, ru, _state.RouteOf(v), kind);
                        }

                        if (score < bestScore)
                        {
                            bestScore = score;
                            bestU = u;
                            bestJ = j;
                            bestKind = kind;
                            bestParts = parts;
                        }
                    }
                }

                RefreshSolo(u);
                for (int kind = 0; kind < 2; kind++)
                {
                    int index = (u * 2) + kind;
                    if (!_soloValid[index])
                    {
                        continue;
                    }

                    ref readonly var parts = ref _soloParts[index];
                    bool feasibleAfter = _state.FeasibleAfter(parts);
                    if (holdFleet && FleetPhase.Refuses(parts.OpensRoute, parts.EmptiesRoute, feasibleAfter, parts.Objective))
                    {
                        continue;
                    }

                    double pen = parts.Penalized(w);
                    bool aspires = feasibleAfter && current + parts.Objective < bestObjective - 1e-9;
                    int to = ru < 0 || kind == 0 ? _soloTarget[u] : _columns - 1;
                    if (!aspires && _tabuUntil[(u * _columns) + to] > iteration)
                    {
                        continue;
                    }

                    double score = pen + (pen >= 0 && !aspires ? diversification * _frequency[(u * _columns) + to] : 0);
                    if (score < bestScore)
                    {
                        bestScore = score;
                        bestU = u;
                        bestJ = -1;
                        bestKind = kind;
                        bestParts = parts;
                    }
                }
            }

            if (bestU < 0)
            {
                return false;
            }

            _chosenU = bestU;
            _chosenV = bestJ >= 0 ? _candidates.At(bestU, bestJ) : -1;

            return bestJ >= 0
                ? Build(ref move, bestU, _candidates.At(bestU, bestJ), bestKind)
                : BuildSolo(ref move, bestU, bestKind);
        }

        private double DiversificationScale(int iteration)
        {
            // λ · c(x) · sqrt(n·m) / iteration (Cordeau et al. 2001), with c(x) the route cost without vehicle weights.
            double cost = _state.Objective;
            int used = _state.UsedRoutes;
            if (_instance.Objective == Objective.VehiclesThenDistance)
            {
                cost -= used * _instance.VehicleWeight;
            }

            return _settings.Diversification * Math.Abs(cost) * Math.Sqrt((double)_n * Math.Max(1, used)) / iteration;
        }

        private void Refresh(int slot, int u, int v)
        {
            int ru = _state.RouteOf(u), rv = _state.RouteOf(v);
            int vu = ru >= 0 ? _state.Version(ru) : 0;
            int vv = rv >= 0 ? _state.Version(rv) : 0;
            if (_cacheRouteU[slot] == ru && _cacheRouteV[slot] == rv && _cacheVersionU[slot] == vu && _cacheVersionV[slot] == vv)
            {
                return;
            }

            _cacheRouteU[slot] = ru;
            _cacheRouteV[slot] = rv;
            _cacheVersionU[slot] = vu;
            _cacheVersionV[slot] = vv;
            var move = default(MoveDraft);
            for (int kind = 0; kind < Kinds; kind++)
            {
                int index = (slot * Kinds) + kind;
                _valid[index] = Build(ref move, u, v, kind);
                if (_valid[index])
                {
                    _parts[index] = _state.EvaluateParts(ref move);
                }
            }
        }

        private bool Build(ref MoveDraft move, int u, int v, int kind)
        {
            var s = _state;
            int ru = s.RouteOf(u), rv = s.RouteOf(v);
            if (ru < 0)
            {
                return kind < 2 && rv >= 0 && MoveBuilder.Insert(s, ref move, u, v, after: kind == 0);
            }

            return kind switch
            {
                0 => MoveBuilder.Relocate(s, ref move, u, v, after: true),
                1 => MoveBuilder.Relocate(s, ref move, u, v, after: false),
                2 => MoveBuilder.Exchange(s, ref move, u, v),
                3 => ru != rv ? MoveBuilder.TwoOptStar(s, ref move, u, v, after: true) : MoveBuilder.TwoOpt(s, ref move, u, v),
                _ => ru != rv ? MoveBuilder.TwoOptStar(s, ref move, u, v, after: false) : MoveBuilder.Relocate(s, ref move, u, v, after: true, chain: 2),
            };
        }

        private void RefreshSolo(int u)
        {
            int ru = _state.RouteOf(u);
            int version = ru >= 0 ? _state.Version(ru) : -2;
            int target = _soloTarget[u];
            bool targetStillEmpty = target >= 0 && target < _state.RouteCount && _state.Length(target) == 0;
            if (_soloRoute[u] == ru && _soloVersion[u] == version && targetStillEmpty)
            {
                return;
            }

            _soloRoute[u] = ru;
            _soloVersion[u] = version;
            _soloTarget[u] = CheapestInsertion.FirstEmptyRoute(_state);
            var move = default(MoveDraft);
            for (int kind = 0; kind < 2; kind++)
            {
                int index = (u * 2) + kind;
                _soloValid[index] = BuildSolo(ref move, u, kind);
                if (_soloValid[index])
                {
                    _soloParts[index] = _state.EvaluateParts(ref move);
                }
            }
        }

        private bool BuildSolo(ref MoveDraft move, int u, int kind)
        {
            int ru = _state.RouteOf(u);
            int empty = _soloTarget[u];
            if (ru < 0)
            {
                return kind == 0 && empty >= 0 && MoveBuilder.Insert(_state, ref move, u, -1, false, empty);
            }

            return kind == 0
                ? empty >= 0 && MoveBuilder.ToEmptyRoute(_state, ref move, u, empty)
                : _instance.MayDrop(u) && MoveBuilder.Drop(_state, ref move, u);
        }

        private bool IsTabu(int u, int v, int ru, int rv, int kind, int iteration)
        {
            if (ru < 0)
            {
                return _tabuUntil[(u * _columns) + rv] > iteration;
            }

            if (ru == rv)
            {
                // Within a route the attributes are the stops themselves: without this, a move and its reverse alternate forever.
                return _tabuUntil[(u * _columns) + ru] > iteration || _tabuUntil[(v * _columns) + ru] > iteration;
            }

            return kind switch
            {
                0 or 1 => _tabuUntil[(u * _columns) + rv] > iteration,
                2 => _tabuUntil[(u * _columns) + rv] > iteration || _tabuUntil[(v * _columns) + ru] > iteration,
                3 => TailTabu(u, ru, rv, iteration) || TailTabu(v, rv, ru, iteration),
                _ => _tabuUntil[(u * _columns) + rv] > iteration || _tabuUntil[(v * _columns) + ru] > iteration,
            };
        }

        // 2-opt* after x hands x's successor (and the rest) to the other route.
        private bool TailTabu(int x, int rx, int to, int iteration)
        {
            int p = _state.PositionOf(x) + 1;
            return p < _state.Length(rx) && _tabuUntil[(_state.StopAt(rx, p) * _columns) + to] > iteration;
        }

        private int Frequency(int u, int v, int ru, int rv, int kind)
        {
            if (ru < 0 || ru == rv)
            {
                return rv >= 0 ? _frequency[(u * _columns) + rv] : 0;
            }

            return kind == 2 ? _frequency[(u * _columns) + rv] + _frequency[(v * _columns) + ru] : _frequency[(u * _columns) + rv];
        }

        /// <summary>Forbids undoing the move: each stop that leaves a route may not return to it for a while.</summary>
        private void MarkTabu(ref MoveDraft move, int iteration)
        {
            int until = iteration + (int)Math.Round(_tenure * (0.5 + _rng.NextDouble()));
            if (move.Inserted >= 0)
            {
                Forbid(move.Inserted, _columns - 1, move.A.Route, until);
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
                Forbid(move.Dropped, _state.RouteOf(move.Dropped), _columns - 1, until);
            }
        }

        // Within a route the move's two stops are the attributes: neither may move again within its route for a while.
        private void MarkIntraRoute(int u, int v, int route, int iteration)
        {
            int until = iteration + (int)Math.Round(_tenure * (0.5 + _rng.NextDouble()));
            _tabuUntil[(u * _columns) + route] = until;
            if (v >= 0)
            {
                _tabuUntil[(v * _columns) + route] = until;
            }
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
                _tabuUntil[(stop * _columns) + from] = until;
            }

            if (to >= 0)
            {
                _frequency[(stop * _columns) + to]++;
            }
        }
    }
}
