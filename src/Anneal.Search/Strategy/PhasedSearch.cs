using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Search.Randomness;

namespace Anneal.Search.Strategy;

/// <summary>
/// The driver of every phased local search (sa, tabu): construction, then, when vehicles cost, the ejection-pool
/// opening (<see cref="FleetSqueeze.Opening"/>) or, when the constructed plan breaks a hard rule, route elimination
/// until the fleet phase is due, its settling and closing squeeze; the distance phase on the held fleet and the
/// polish; restarts on stagnation; adaptive prices; the best plan, the trace and the target. The search itself
/// (<see cref="ILocalSearch"/>) only steps and reacts.
/// </summary>
public sealed class PhasedSearch
{
    private readonly SearchStart _start;
    private readonly SearchRun _run;
    private readonly ILocalSearch _search;
    private readonly SearchRhythm _rhythm;
    private long _iteration;
    private double _lastImprovedAt;
    private bool _polishing;
    private double _offeredAt = double.NegativeInfinity;

    private PhasedSearch(SearchStart start, SearchRun run, ILocalSearch search)
    {
        _start = start;
        _run = run;
        _search = search;
        _rhythm = search.Rhythm;
    }

    /// <summary>One run of the search made by <paramref name="create"/>, under the shared settings.</summary>
    public static SolverResult Run(
        string solver,
        Instance instance,
        SolveOptions options,
        SearchSettings settings,
        Func<SearchRun, ILocalSearch> create,
        IProgress<TracePoint>? progress,
        CancellationToken cancel)
    {
        var start = SearchStart.Begin(instance, options, settings.Neighbours, progress, cancel);
        var prices = start.Prices(settings.PriceStep);
        var keeper = new BestKeeper(start.State);
        var phase = new FleetPhase(RouteElimination.Applies(instance), settings.FleetShare, settings.FleetPatience);
        var run = new SearchRun(start, keeper, phase, prices, new SearchRandom(options.Seed), settings, options);
        var driver = new PhasedSearch(start, run, create(run));
        driver.Loop();
        var budget = start.Budget;
        return new SolverResult(solver, keeper.BestPlan(start.State), budget.Elapsed, start.Trace.SecondsToBest, start.Trace.Points, budget.StopReason);
    }

    private void Loop()
    {
        var (budget, trace, _, state) = _start;
        var keeper = _run.Keeper;
        trace.Improved(Point("construction"));
        Offer();
        _search.Begin();
        FleetSqueeze.Opening(_start, keeper, _run.Phase, _run.Random, _run.Settings.SqueezeShare, _run.Settings.SqueezePatience, _rhythm.WorkPerIteration, out _iteration);
        _lastImprovedAt = budget.Progress(_iteration);
        int checkMask = _rhythm.CheckEvery - 1;
        double? target = _run.Options.TargetObjective;
        while (!budget.Exhausted(_iteration))
        {
            _iteration++;
            bool check = (_iteration & checkMask) == 0;
            if (check && !_rhythm.CheckAfterStep)
            {
                Check();
            }

            var step = _search.Step(_iteration);
            if (step == StepResult.Stopped)
            {
                break;
            }

            if (step == StepResult.Skipped)
            {
                continue;
            }

            if (keeper.Offer(state))
            {
                _lastImprovedAt = budget.Progress(_iteration);
                _run.Phase.NewBest(state, _lastImprovedAt);
                trace.Improved(Point(_search.Note));
                if (target is { } t && keeper.HasFeasible && keeper.Objective <= t)
                {
                    budget.ReachTarget();
                    break;
                }
            }

            if (check && _rhythm.CheckAfterStep)
            {
                Check();
            }
        }

        trace.Finish(Point(_search.Note));
    }

    /// <summary>Phases, polish, prices, restarts and a trace sample, in this order.</summary>
    private void Check()
    {
        var (budget, trace, candidates, state) = _start;
        var (keeper, phase, prices, rng, settings) = (_run.Keeper, _run.Phase, _run.Prices, _run.Random, _run.Settings);
        int priceMask = _rhythm.PricesEvery - 1;
        if (_rhythm.PricesFirst && (_iteration & priceMask) == 0)
        {
            prices.Update(state);
        }

        double p = budget.Progress(_iteration);
        if (phase.Due(p))
        {
            // The fleet is settled: repair the last attempt, squeeze what the ejection pool can, and go on to distance.
            if (Restart.Settle(state, keeper, prices, candidates, rng))
            {
                trace.Improved(Point("repaired"));
            }

            _iteration = FleetSqueeze.Run(_start, keeper, phase, rng, _iteration, settings.SqueezeShare / 4, settings.SqueezePatience, _rhythm.WorkPerIteration);
            phase.BeginDistance(p = budget.Progress(_iteration));
            _search.OnPhase(SearchPhase.Distance);
            _lastImprovedAt = p;
        }

        double q = phase.Within(p);
        if (settings.PolishFrom is { } polishFrom && !_polishing && _run.HoldsFleet && q >= polishFrom)
        {
            _polishing = true;
            Restart.FromBest(state, keeper, prices, false, rng);
            _search.OnPhase(SearchPhase.Polish);
        }

        _search.OnCheck(p, q);
        if (!_rhythm.PricesFirst && (_iteration & priceMask) == 0)
        {
            prices.Update(state);
        }

        double stagnation = phase.Eliminating ? settings.StagnationFraction / 2 : settings.StagnationFraction;
        if (p - _lastImprovedAt > stagnation && (settings.RestartsByPhase ? q : p) < settings.RestartsUntil)
        {
            if (Restart.AfterStall(state, keeper, prices, candidates, phase, p, rng))
            {
                trace.Improved(Point("repaired"));
            }

            _search.OnRestart();
            _lastImprovedAt = p;
        }

        if (trace.SampleDue(budget.Elapsed))
        {
            trace.Sample(Point(_search.Note));
        }

        if (budget.Elapsed - _offeredAt >= OfferEvery)
        {
            Offer();
        }
    }

    /// <summary>Seconds between offers of the best plan to the run's incumbent: the plan is copied at most this often.</summary>
    private const double OfferEvery = 0.25;

    /// <summary>
    /// Offers the best plan to the run's <see cref="Incumbent"/> when it beats what is held there, so that the run
    /// still has a plan should this search not return in time. Reads only; the search goes on exactly as without it.
    /// </summary>
    private void Offer()
    {
        _offeredAt = _start.Budget.Elapsed;
        var keeper = _run.Keeper;
        if (_run.Options.Incumbent is { } incumbent && incumbent.Wants(keeper.HasFeasible, keeper.Objective))
        {
            incumbent.Offer(keeper.BestPlan(_start.State), keeper.HasFeasible, keeper.Objective);
        }
    }

    private TracePoint Point(string note) =>
        new(_start.Budget.Elapsed, _iteration, _run.Keeper.Objective, _start.State.Objective, _run.Keeper.HasFeasible, note);
}
