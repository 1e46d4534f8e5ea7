using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Core.Replanning;
using Anneal.Core.Solving;
using Anneal.Jobs.Replanning;
using Anneal.Search.Annealing;
using Anneal.Search.Tabu;
using CsCheck;

namespace Anneal.Tests.Jobs.Replanning;

/// <summary>A warm start from a plan that keeps every hard rule never ends worse than that plan (property over random plans).</summary>
public class WarmStartTests
{
    [Fact]
    public void A_warm_start_from_a_feasible_plan_never_returns_a_worse_objective()
    {
        int tried = 0;
        Gen.Int[1, 1_000_000].Sample(seed =>
        {
            var rng = new Random(seed);
            var job = RandomInstances.Create(rng, 8, 3, hardWindows: false);
            var plan = RandomPlan(rng, job);
            var given = PlanEvaluator.Evaluate(job, plan);
            if (!given.Feasible)
            {
                return;
            }

            Interlocked.Increment(ref tried);

            // The given plan's own times become the stability reference, as when it comes from an earlier run's routes.csv.
            var routes = given.Routes.Select(r => new GivenRoute(r.Vehicle,
                [.. r.Stops.Select((s, k) => new GivenVisit(k + 2, job.Stops[s].Id, s, r.Visits[k].Start, r.Visits[k].Departure, null, false))], null, null)).ToList();
            var day = DayReduction.Reduce(job, new ReplanRequest(new GivenPlan("plan.csv", routes), null, new HashSet<int>()));
            var judge = new WarmStartJudge(day.Instance, day.Start);
            Assert.Equal(given.Objective, judge.Start.Objective, 6);

            ISolver solver = seed % 2 == 0 ? new SimulatedAnnealing() : new TabuSearch();
            var options = new SolveOptions { TimeLimit = TimeSpan.FromSeconds(10), IterationLimit = 300, Seed = seed, StartPlan = day.Start };
            var judged = judge.Judge(day.Instance, solver.Solve(day.Instance, options, null, CancellationToken.None));

            Assert.True(judged.Evaluation.Feasible);
            Assert.True(judged.Evaluation.Objective <= given.Objective + 1e-6, $"seed {seed}: {judged.Evaluation.Objective} > {given.Objective}");
            Assert.Equal("given plan", judged.Result.Trace[0].State);
            Assert.Equal(given.Objective, judged.Result.Trace[0].BestObjective, 6);
        }, iter: 40);
        Assert.True(tried > 0, "no random plan kept every hard rule");
    }

    /// <summary>Each stop on a random vehicle, in random order.</summary>
    private static Plan RandomPlan(Random rng, Anneal.Core.Model.Instance job)
    {
        var lists = Enumerable.Range(0, job.Vehicles.Count).Select(_ => new List<int>()).ToArray();
        foreach (int s in Enumerable.Range(0, job.StopCount).OrderBy(_ => rng.Next()))
        {
            lists[rng.Next(lists.Length)].Add(s);
        }

        return new Plan([.. lists.Select((l, v) => new PlannedRoute(v, [.. l])).Where(r => r.Stops.Length > 0)]);
    }
}
