using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Search.Construction;

namespace Anneal.Tests.Search.Construction;

/// <summary>
/// The drivable form of a plan: every route keeps the hard rules, and the order of plans never ranks it below the
/// plan it came from. Random plans on random instances (seeded), judged by the exact evaluator.
/// </summary>
public class SalvageTests
{
    [Fact]
    public void Every_route_of_the_drivable_form_keeps_the_hard_rules_and_it_never_ranks_worse()
    {
        var rng = new Random(16);
        for (int round = 0; round < 60; round++)
        {
            var instance = RandomInstances.Create(rng, stops: rng.Next(4, 25), vehicles: rng.Next(1, 4), hardWindows: rng.Next(2) == 0, multiWindows: true, dims: 2);
            var plan = RandomPlan(rng, instance.StopCount, instance.Vehicles.Count);
            var before = PlanEvaluator.Evaluate(instance, plan);

            var after = PlanEvaluator.Evaluate(instance, Salvage.Drivable(instance, plan));

            Assert.All(after.Routes, r => Assert.True(r.Feasible, $"round {round}: route of vehicle {r.Vehicle} breaks a hard rule"));
            Assert.DoesNotContain(after.Violations, v => v.Hard && v.Rule != RuleKind.Unserved);
            Assert.False(PlanRanking.IsBetter(before, after), $"round {round}: the drivable form ranks below the plan");
        }
    }

    /// <summary>Every stop on a random vehicle in random order, a few left out: crowded routes that break rules.</summary>
    private static Plan RandomPlan(Random rng, int stops, int vehicles)
    {
        var routes = Enumerable.Range(0, vehicles).Select(_ => new List<int>()).ToArray();
        foreach (int s in Enumerable.Range(0, stops).OrderBy(_ => rng.Next()))
        {
            if (rng.Next(8) != 0)
            {
                routes[rng.Next(vehicles)].Add(s);
            }
        }

        return new Plan(routes.Select((r, v) => new PlannedRoute(v, r.ToArray())).ToList());
    }
}
