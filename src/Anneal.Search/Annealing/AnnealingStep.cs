using Anneal.Search.Moves;
using Anneal.Search.Representation;
using Anneal.Search.Strategy;

namespace Anneal.Search.Annealing;

/// <summary>
/// One annealing step: a random granular move accepted by the Metropolis rule, or on a held fleet every
/// <see cref="AnnealingSettings.RuinEvery"/> steps a string ruin; and the temperature schedule, recomputed at each
/// check of the driver.
/// </summary>
internal sealed class AnnealingStep : ILocalSearch
{
    private readonly SearchRun _run;
    private readonly AnnealingSettings _settings;
    private readonly SearchState _state;
    private readonly MoveSampler _sampler;
    private readonly StringRuin _ruin;
    private MoveDraft _move;
    private double _firstTemperature;
    private double _startTemperature;
    private double _temperature;
    private double _boost;
    private bool _holdFleet;
    private int _sinceRuin;

    public AnnealingStep(SearchRun run, AnnealingSettings settings)
    {
        _run = run;
        _settings = settings;
        _state = run.State;
        _sampler = new MoveSampler(run.State, run.Candidates, run.Random);
        _ruin = new StringRuin(run.State, run.Candidates, run.Random);
    }

    // Samples a move per step, so the driver checks every 1024 steps, before the step, and updates prices every 4096.
    public SearchRhythm Rhythm => new(CheckEvery: 1024, CheckAfterStep: false, PricesEvery: 4096, PricesFirst: false, WorkPerIteration: 1);

    public string Note => $"T={_temperature:G4}";

    /// <summary>
    /// The first temperature accepts the median worsening move of the constructed plan with probability
    /// <see cref="AnnealingSettings.StartAcceptance"/>. The pool's plans are poor in distance, so after an opening the
    /// distance phase starts as hot as the run would have (cooler starts, 0.3 and 0.1 of it, ended 1.5 and 2.5
    /// points further from the best known on r1_10_1).
    /// </summary>
    public void Begin()
    {
        _firstTemperature = Calibrate(_state, _sampler, _settings.StartAcceptance);
        _startTemperature = _firstTemperature;
        _temperature = _startTemperature;
    }

    public StepResult Step(long iteration)
    {
        if (_holdFleet && ++_sinceRuin >= _settings.RuinEvery && _settings.RuinEvery > 0 && _state.Feasible)
        {
            // A compound move, counted as one step: on a held fleet the plain moves stall where whole strings of
            // stops must change routes at once.
            _sinceRuin = 0;
            _run.Keeper.Reset(_state, (_ruin, _temperature), static (_, a) => a._ruin.Attempt(a._temperature));
            return StepResult.Moved;
        }

        if (!_sampler.Next(ref _move))
        {
            return StepResult.Skipped;
        }

        var effect = _state.Evaluate(ref _move);
        if (effect.Penalized > 0 && _run.Random.NextDouble() >= Math.Exp(-effect.Penalized / _temperature))
        {
            return StepResult.Skipped;
        }

        // On a held fleet the search stays among plans that keep to the hard rules, where the ruin works: with
        // priced violations the current plan sat infeasible for most of the phase and the ruin idled.
        if (_holdFleet && (!effect.FeasibleAfter || FleetPhase.Refuses(_state.OpensRoute(ref _move), _state.EmptiesRoute(ref _move), effect.FeasibleAfter, effect.Objective)))
        {
            return StepResult.Skipped;
        }

        _run.Keeper.Apply(_state, ref _move, effect);
        return StepResult.Moved;
    }

    public void OnCheck(double progress, double withinPhase)
    {
        _holdFleet = _run.HoldsFleet;
        _boost *= 0.9;
        _temperature = _startTemperature * Cooling(_holdFleet, withinPhase) * (1 + _boost);
    }

    public void OnPhase(SearchPhase phase)
    {
        if (phase == SearchPhase.Distance)
        {
            // Anneal distance afresh from the best plan, warm but not so hot as to undo it.
            _startTemperature = _firstTemperature * _settings.DistanceStartRatio;
        }

        _boost = 0;
    }

    public void OnRestart() => _boost = _settings.ReheatBoost;

    /// <summary>
    /// Temperature as a fraction of the phase's start. On a held fleet it falls to <c>HeldEndRatio</c> by
    /// <c>PolishFrom</c> of the phase and on to <c>EndRatio</c> after; otherwise straight to <c>EndRatio</c>.
    /// </summary>
    private double Cooling(bool holdFleet, double q)
    {
        var c = _settings;
        if (!holdFleet)
        {
            return Math.Pow(c.EndRatio, q);
        }

        return q < c.PolishFrom
            ? Math.Pow(c.HeldEndRatio, q / c.PolishFrom)
            : c.HeldEndRatio * Math.Pow(c.EndRatio / c.HeldEndRatio, (q - c.PolishFrom) / (1 - c.PolishFrom));
    }

    /// <summary>
    /// Temperature at which the median worsening move of the starting plan is accepted with the given probability.
    /// Measured on the objective alone: violation prices are the adapter's business, not the temperature's.
    /// </summary>
    private static double Calibrate(SearchState state, MoveSampler sampler, double acceptance)
    {
        var deltas = new List<double>();
        var move = default(MoveDraft);
        for (int k = 0; k < 2000 && deltas.Count < 400; k++)
        {
            if (sampler.Next(ref move))
            {
                double d = state.Evaluate(ref move).Objective;
                if (d > 1e-9 && !double.IsInfinity(d))
                {
                    deltas.Add(d);
                }
            }
        }

        if (deltas.Count == 0)
        {
            return 1.0;
        }

        deltas.Sort();
        double median = deltas[deltas.Count / 2];
        return median / -Math.Log(acceptance);
    }
}
