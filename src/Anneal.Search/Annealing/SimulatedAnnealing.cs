using Anneal.Core.Model;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;
using Anneal.Core.Solving;
using Anneal.Search.Running;
using Anneal.Search.Strategy;

namespace Anneal.Search.Annealing;

/// <summary>
/// Simulated annealing (Kirkpatrick, Gelatt &amp; Vecchi 1983; for routing Osman 1993, Chiang &amp; Russell 1996)
/// over the granular neighbourhoods, seeded by cheapest insertion. The start temperature is calibrated from
/// sampled move deltas; cooling is geometric in the fraction of the budget used, so a 10 s and a 10 min run both
/// finish cold; on stagnation the search returns to the best plan and reheats; hard-rule prices adapt. With the
/// fleet held, string ruins (<see cref="StringRuin"/>) join the plain moves and the search keeps to the hard rules.
/// </summary>
public sealed class SimulatedAnnealing : SeededSearch
{
    private readonly AnnealingSettings _settings;

    public SimulatedAnnealing(AnnealingSettings? settings = null)
    {
        _settings = settings ?? new AnnealingSettings();
    }

    public override string Name => "sa";

    public override string? Declines(Instance instance) => PickupSupport.Declines(instance);

    protected override SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var start = SearchStart.Begin(instance, options, _settings.Neighbours, progress, cancel);
        var (budget, trace, candidates, state) = start;
        var adapter = start.Prices(0.2);
        var rng = new SearchRandom(options.Seed);
        var keeper = new BestKeeper(state);
        var sampler = new MoveSampler(state, candidates, rng);
        trace.Improved(Point(budget, 0, keeper, state, "construction"));

        var phase = new FleetPhase(RouteElimination.Applies(instance), _settings.FleetShare, _settings.FleetPatience);
        double firstTemperature = Calibrate(state, sampler, _settings.StartAcceptance);
        double startTemperature = firstTemperature;
        double temperature = startTemperature;
        double boost = 0;
        long iteration = 0;
        double lastImprovedAt = 0;
        // The pool's plans are poor in distance, so after it the distance phase starts as hot as the run would have
        // (cooler starts, 0.3 and 0.1 of it, ended 1.5 and 2.5 points further from the best known on r1_10_1).
        if (FleetSqueeze.Opening(start, keeper, phase, rng, _settings.SqueezeShare, _settings.SqueezePatience, 1, out iteration))
        {
            lastImprovedAt = budget.Progress(iteration);
        }

        bool holdFleet = false;
        bool polishing = false;
        var ruin = new StringRuin(state, candidates, rng);
        int sinceRuin = 0;
        var move = default(MoveDraft);
        while (!budget.Exhausted(iteration))
        {
            iteration++;
            if ((iteration & 1023) == 0)
            {
                double p = budget.Progress(iteration);
                if (phase.Due(p))
                {
                    // The fleet is settled: anneal distance afresh from the best plan, warm but not so hot as to undo it.
                    if (Restart.Settle(state, keeper, adapter, candidates, rng))
                    {
                        trace.Improved(Point(budget, iteration, keeper, state, "repaired"));
                    }

                    iteration = FleetSqueeze.Run(start, keeper, phase, rng, iteration, _settings.SqueezeShare / 4, _settings.SqueezePatience, 1);
                    phase.BeginDistance(p = budget.Progress(iteration));

                    startTemperature = firstTemperature * _settings.DistanceStartRatio;
                    boost = 0;
                    lastImprovedAt = p;
                }

                holdFleet = phase.HoldsFleet && keeper.HasFeasible;
                double q = phase.Within(p);
                boost *= 0.9;
                if (holdFleet && !polishing && q >= _settings.PolishFrom)
                {
                    // The warm schedule ends: polish the best plan cold for the rest of the phase.
                    polishing = true;
                    Restart.FromBest(state, keeper, adapter, false, rng);
                    boost = 0;
                }

                temperature = startTemperature * Cooling(holdFleet, q) * (1 + boost);
                if ((iteration & 4095) == 0)
                {
                    adapter.Update(state);
                }

                double stagnation = phase.Eliminating ? _settings.StagnationFraction / 2 : _settings.StagnationFraction;
                if (p - lastImprovedAt > stagnation && q < 0.85)
                {
                    if (Restart.AfterStall(state, keeper, adapter, candidates, phase, p, rng))
                    {
                        trace.Improved(Point(budget, iteration, keeper, state, "repaired"));
                    }

                    boost = _settings.ReheatBoost;
                    lastImprovedAt = p;
                }

                long it = iteration;
                double t = temperature;
                trace.Sample(budget.Elapsed, () => Point(budget, it, keeper, state, $"T={t:G4}"));
            }

            if (holdFleet && ++sinceRuin >= _settings.RuinEvery && _settings.RuinEvery > 0 && state.Feasible)
            {
                // A compound move, counted as one iteration: on a held fleet the plain moves stall where whole
                // strings of stops must change routes at once.
                sinceRuin = 0;
                keeper.BeforeReset(state);
                ruin.Attempt(temperature);
            }
            else
            {
                if (!sampler.Next(ref move))
                {
                    continue;
                }

                var effect = state.Evaluate(ref move);
                if (effect.Penalized > 0 && rng.NextDouble() >= Math.Exp(-effect.Penalized / temperature))
                {
                    continue;
                }

                // On a held fleet the search stays among plans that keep to the hard rules, where the ruin works:
                // with priced violations the current plan sat infeasible for most of the phase and the ruin idled.
                if (holdFleet && (!effect.FeasibleAfter || FleetPhase.Refuses(state.OpensRoute(ref move), state.EmptiesRoute(ref move), effect.FeasibleAfter, effect.Objective)))
                {
                    continue;
                }

                keeper.BeforeApply(state, effect);
                state.Apply(ref move);
            }

            if (keeper.Offer(state))
            {
                lastImprovedAt = budget.Progress(iteration);
                phase.NewBest(state, lastImprovedAt);
                trace.Improved(Point(budget, iteration, keeper, state, $"T={temperature:G4}"));
                if (options.TargetObjective is { } target && keeper.HasFeasible && keeper.Objective <= target)
                {
                    budget.ReachTarget();
                    break;
                }
            }
        }

        trace.Finish(Point(budget, iteration, keeper, state, $"T={temperature:G4}"));
        var plan = keeper.BestPlan(state);
        return new SolverResult(Name, plan, budget.Elapsed, trace.SecondsToBest, trace.Points, budget.StopReason);
    }

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

    private static TracePoint Point(Budget budget, long iteration, BestKeeper keeper, SearchState state, string note) =>
        new(budget.Elapsed, iteration, keeper.Objective, state.Objective, keeper.HasFeasible, note);

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
