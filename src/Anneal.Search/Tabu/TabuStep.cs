using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;
using Anneal.Search.Strategy;

namespace Anneal.Search.Tabu;

/// <summary>
/// One tabu step: the best admissible move of the granular neighbourhood (<see cref="TabuMoves"/>), where a tabu
/// move (<see cref="TabuList"/>) is admissible only if it gives a new best feasible plan (aspiration), and
/// non-improving moves pay for attributes used often (diversification).
/// </summary>
internal sealed class TabuStep : ILocalSearch
{
    private readonly SearchRun _run;
    private readonly TabuSettings _settings;
    private readonly Instance _instance;
    private readonly SearchState _state;
    private readonly CandidateLists _candidates;
    private readonly TabuMoves _moves;
    private readonly TabuList _tabu;
    private readonly int _n;
    private readonly int _k;
    private MoveDraft _move;
    private int _window;

    public TabuStep(SearchRun run, TabuSettings settings)
    {
        _run = run;
        _settings = settings;
        _state = run.State;
        _instance = _state.Instance;
        _candidates = run.Candidates;
        _n = _state.StopCount;
        _k = _candidates.K;
        _moves = new TabuMoves(_state, _candidates);
        _tabu = new TabuList(_state, run.Random, settings.TenureFactor * Math.Log10(Math.Max(10, _n)));

        // Route evaluations the ejection pool counts as one tabu iteration: about what a neighbourhood scan costs.
        long work = Math.Max(1, (long)Math.Min(_n, settings.MaxStopsPerIteration) * _k);
        Rhythm = new(CheckEvery: 1, CheckAfterStep: true, PricesEvery: 1, PricesFirst: true, WorkPerIteration: work);
    }

    // A step scans the whole neighbourhood, so the driver checks, and the prices adapt, after every step.
    public SearchRhythm Rhythm { get; }

    public string Note => $"tenure={_tabu.Tenure:0.#}";

    public void Begin()
    {
    }

    public StepResult Step(long iteration)
    {
        if (!SelectBest(iteration, ref _move, out var parts, out int u, out int v))
        {
            return StepResult.Stopped;
        }

        var effect = parts.Effect(_state.Weights);
        effect.FeasibleAfter = _state.FeasibleAfter(parts);
        _tabu.Mark(ref _move, iteration);
        if (_move.RouteCount == 1 && _move.Inserted < 0 && _move.Dropped < 0)
        {
            _tabu.MarkWithin(u, v, _move.A.Route, iteration);
        }

        _run.Keeper.Apply(_state, ref _move, effect);
        return StepResult.Moved;
    }

    public void OnCheck(double progress, double withinPhase)
    {
    }

    public void OnPhase(SearchPhase phase) => _tabu.Clear();

    public void OnRestart() => _tabu.Clear();

    private bool SelectBest(long iteration, ref MoveDraft move, out MoveParts bestParts, out int chosenU, out int chosenV)
    {
        var w = _state.Weights;
        var keeper = _run.Keeper;
        double current = _state.Objective;
        double bestObjective = keeper.HasFeasible ? keeper.Objective : double.PositiveInfinity;
        double diversification = DiversificationScale(iteration);
        bool holdFleet = _run.HoldsFleet;
        double bestScore = double.PositiveInfinity;
        int bestU = -1, bestJ = -1, bestSlot = -1;
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
                int pair = (u * _k) + j;
                int v = _candidates.At(u, j);
                _moves.Refresh(pair, u, v);
                for (int slot = 0; slot < PairMoves.Slots; slot++)
                {
                    if (!_moves.Valid(pair, slot))
                    {
                        continue;
                    }

                    ref readonly var parts = ref _moves.Parts(pair, slot);
                    if (!Judge(parts, w, holdFleet, current, bestObjective, out double pen, out bool aspires)
                        || (!aspires && _tabu.IsTabu(u, v, ru, _state.RouteOf(v), slot, iteration)))
                    {
                        continue;
                    }

                    double score = Score(pen, aspires, diversification, pen >= 0 && !aspires ? _tabu.Frequency(u, v, ru, _state.RouteOf(v), slot) : 0);
                    if (score < bestScore)
                    {
                        bestScore = score;
                        bestU = u;
                        bestJ = j;
                        bestSlot = slot;
                        bestParts = parts;
                    }
                }
            }

            _moves.RefreshSolo(u);
            for (int slot = 0; slot < PairMoves.Solo.Length; slot++)
            {
                if (!_moves.SoloValid(u, slot))
                {
                    continue;
                }

                ref readonly var parts = ref _moves.SoloParts(u, slot);
                int to = ru < 0 || PairMoves.Solo[slot] != MoveKind.Drop ? _moves.SoloTarget(u) : _tabu.Pool;
                if (!Judge(parts, w, holdFleet, current, bestObjective, out double pen, out bool aspires) || (!aspires && _tabu.IsTabu(u, to, iteration)))
                {
                    continue;
                }

                double score = Score(pen, aspires, diversification, _tabu.Frequency(u, to));
                if (score < bestScore)
                {
                    bestScore = score;
                    bestU = u;
                    bestJ = -1;
                    bestSlot = slot;
                    bestParts = parts;
                }
            }
        }

        chosenU = bestU;
        chosenV = bestU >= 0 && bestJ >= 0 ? _candidates.At(bestU, bestJ) : -1;
        if (bestU < 0)
        {
            return false;
        }

        return bestJ >= 0
            ? PairMoves.Build(_state, ref move, bestU, chosenV, bestSlot)
            : _moves.BuildSolo(ref move, bestU, bestSlot);
    }

    /// <summary>
    /// False when holding the fleet refuses the move; else its penalized change and whether it aspires (it would give
    /// a new best plan that keeps the hard rules, which lifts its tabu).
    /// </summary>
    private bool Judge(in MoveParts parts, in PenaltyWeights w, bool holdFleet, double current, double bestObjective, out double pen, out bool aspires)
    {
        bool feasibleAfter = _state.FeasibleAfter(parts);
        if (holdFleet && FleetPhase.Refuses(parts.OpensRoute, parts.EmptiesRoute, feasibleAfter, parts.Objective))
        {
            pen = 0;
            aspires = false;
            return false;
        }

        pen = parts.Penalized(w);
        aspires = feasibleAfter && current + parts.Objective < bestObjective - 1e-9;
        return true;
    }

    /// <summary>A move that does not improve pays for how often its attributes were used (Cordeau et al. 2001).</summary>
    private static double Score(double pen, bool aspires, double diversification, int frequency) =>
        pen >= 0 && !aspires ? pen + (diversification * frequency) : pen;

    private double DiversificationScale(long iteration)
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
}
