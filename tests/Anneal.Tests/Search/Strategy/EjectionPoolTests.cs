using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Search.Annealing;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;
using Anneal.Core.Solving;
using Anneal.Search.Strategy;

namespace Anneal.Tests.Search.Strategy;

public class EjectionPoolTests
{
    private static Instance Solomon(string name) =>
        SolomonReader.Parse(File.ReadAllText(BenchmarkData.File($"solomon/{name}.txt")), $"{name}.txt").With(objective: Objective.VehiclesThenDistance);

    // Solomon rc101 (Solomon 1987), read from ../shared/benchmarks. After every step of the pool, the routes keep to
    // the hard windows and capacity as the exact evaluator judges them, and every stop is on exactly one route or
    // in the pool: ejections must not lose or duplicate stops.
    [SkippableFact]
    public void EveryStepKeepsEachRouteFeasibleAndEveryStopAccountedFor()
    {
        var instance = Solomon("rc101");
        var candidates = new CandidateLists(instance, 30);
        var state = InsertionSolver.Build(instance, candidates);
        Assert.True(state.Feasible);
        var pool = new EjectionPool(state, candidates, new SearchRandom(7));
        pool.Begin(LongestRoute(state));

        for (int step = 0; step < 400 && pool.Waiting > 0; step++)
        {
            pool.Step();
            Assert.Equal(0, state.InfeasibleRoutes);
            Assert.Equal(pool.Waiting, state.UnservedCount);
            var truth = PlanEvaluator.Evaluate(instance, state.ToPlan());
            var broken = truth.Violations.Where(v => v.Hard && v.Rule != RuleKind.Unserved).Select(v => v.Message).ToList();
            Assert.True(broken.Count == 0, string.Join("; ", broken));
            Assert.Equal(instance.StopCount, CountServed(state.ToPlan()) + state.UnservedCount);
        }
    }

    // Solomon c101 is served by 10 vehicles in the best-known solution (bks.csv, vehicles-first: Solomon 1987 via
    // the SINTEF TOP tables). From the insertion plan, the pool alone must get down to that fleet within a fixed
    // amount of work, and the plan it leaves must be feasible by the exact evaluator.
    [SkippableFact]
    public void ReachesTheBestKnownFleetOnC101()
    {
        var instance = Solomon("c101");
        var start = SearchStart.Begin(instance, new SolveOptions { Seed = 3, IterationLimit = 2_000_000 }, 30, null, CancellationToken.None);
        var keeper = new BestKeeper(start.State);
        var phase = new FleetPhase(reduceVehicles: true, share: 0.6, patience: 0.3);

        FleetSqueeze.Run(start, keeper, phase, new SearchRandom(3), iteration: 0, share: 1.0, patience: 1.0, workPerIteration: 1);

        var plan = keeper.BestPlan(start.State);
        var truth = PlanEvaluator.Evaluate(instance, plan);
        Assert.True(truth.Feasible, string.Join("; ", truth.Violations.Select(v => v.Message)));
        Assert.Equal(10, truth.VehiclesUsed);
    }

    // Reproducibility: with an iteration limit the pool's work is counted in iterations, so the same seed gives
    // the same routes (Solomon r101, from ../shared/benchmarks).
    [SkippableFact]
    public void SameSeedAndIterationLimitGiveTheSameRoutes()
    {
        var instance = Solomon("r101");
        string Once()
        {
            var result = new SimulatedAnnealing().Solve(instance, new SolveOptions { Seed = 5, IterationLimit = 400_000, TimeLimit = TimeSpan.FromMinutes(5) }, null, CancellationToken.None);
            return string.Join("|", result.Plan.Routes.Select(r => string.Join(",", r.Stops)));
        }

        Assert.Equal(Once(), Once());
    }

    private static int LongestRoute(SearchState state)
    {
        int best = 0;
        for (int r = 1; r < state.RouteCount; r++)
        {
            if (state.Length(r) > state.Length(best))
            {
                best = r;
            }
        }

        return best;
    }

    private static int CountServed(Plan plan) => plan.Routes.Sum(r => r.Stops.Length);
}
