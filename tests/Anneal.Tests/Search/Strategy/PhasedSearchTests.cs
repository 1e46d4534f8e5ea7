using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Strategy;

namespace Anneal.Tests.Search.Strategy;

/// <summary>
/// The driver with a local search of a few lines plugged in (a descent: random granular moves kept when they make
/// the plan no dearer), as a new search would be: it runs every phase the driver owns and its plan is judged by
/// the evaluator, the truth.
/// </summary>
public sealed class PhasedSearchTests
{
    private sealed class Descent(SearchRun run) : ILocalSearch
    {
        private readonly MoveSampler _sampler = new(run.State, run.Candidates, run.Random);
        private MoveDraft _move;

        public SearchRhythm Rhythm => new(CheckEvery: 1024, CheckAfterStep: false, PricesEvery: 4096, PricesFirst: false, WorkPerIteration: 1);

        public string Note => "descent";

        public StepResult Step(long iteration)
        {
            if (!_sampler.Next(ref _move))
            {
                return StepResult.Skipped;
            }

            var effect = run.State.Evaluate(ref _move);
            bool refused = run.HoldsFleet && (!effect.FeasibleAfter
                || FleetPhase.Refuses(run.State.OpensRoute(ref _move), run.State.EmptiesRoute(ref _move), effect.FeasibleAfter, effect.Objective));
            if (effect.Penalized > 0 || refused)
            {
                return StepResult.Skipped;
            }

            run.Keeper.Apply(run.State, ref _move, effect);
            return StepResult.Moved;
        }

        public void Begin()
        {
        }

        public void OnCheck(double progress, double withinPhase)
        {
        }

        public void OnPhase(SearchPhase phase)
        {
        }

        public void OnRestart()
        {
        }
    }

    private static SolverResult Run(Instance instance, int seed) =>
        PhasedSearch.Run("descent", instance, new SolveOptions { IterationLimit = 300_000, TimeLimit = TimeSpan.FromMinutes(5), Seed = seed },
            new SearchSettings(), run => new Descent(run), null, CancellationToken.None);

    // Solomon c101 (Solomon 1987, from ../shared/benchmarks) under vehicles-then-distance: the driver opens with the
    // ejection pool, then the descent works on distance with the fleet held. The plan must keep every hard rule by
    // the evaluator, serve every stop, and be no worse than the cheapest-insertion plan it started from.
    [SkippableFact]
    public void A_descent_plugged_into_the_driver_improves_the_constructed_plan_and_keeps_the_rules()
    {
        var path = BenchmarkData.File("solomon/c101.txt");
        var instance = SolomonReader.Parse(File.ReadAllText(path), "c101.txt").With(objective: Objective.VehiclesThenDistance);
        var constructed = PlanEvaluator.Evaluate(instance, InsertionSolver.Build(instance, new(instance, 30)).ToPlan());

        var result = Run(instance, seed: 2);
        var plan = PlanEvaluator.Evaluate(instance, result.Plan);

        Assert.True(plan.Feasible, string.Join("; ", plan.Violations.Select(v => v.Message)));
        Assert.Empty(plan.Unserved);
        Assert.True(plan.Objective <= constructed.Objective, $"descent {plan.Objective}, construction {constructed.Objective}");
        Assert.True(plan.VehiclesUsed < constructed.VehiclesUsed, $"the ejection pool left {plan.VehiclesUsed} of {constructed.VehiclesUsed} routes");
        Assert.Equal(SolverStatus.IterationLimit, result.Status);
        Assert.Contains(result.Trace, p => p.State.StartsWith("ejection pool", StringComparison.Ordinal));
        Assert.Equal(result.Plan.Routes.Select(r => string.Join(' ', r.Stops)), Run(instance, seed: 2).Plan.Routes.Select(r => string.Join(' ', r.Stops)));
    }
}
