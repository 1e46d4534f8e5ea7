using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Input;

namespace Anneal.Tests.Core.Evaluation;

public class MissedWindowTests
{
    [SkippableFact]
    public void Swapping_two_stops_of_the_c101_best_route_misses_a_window()
    {
        var instance = SolomonReader.Parse(File.ReadAllText(BenchmarkData.File("solomon/c101.txt")), "c101.txt");
        var plan = RouteFileReader.Read(BenchmarkData.File("solomon/c101.vehicles-first.sol"), instance);

        // In c101 customer 5 has window [15, 67] and customer 3 [65, 146], both with service 90 (Solomon 1987 data).
        // Serving 3 first means service at 3 ends at 155, far past 5's due date 67.
        int five = IndexOf(instance, "5");
        int three = IndexOf(instance, "3");
        var routes = plan.Routes.Select(r => r with { Stops = (int[])r.Stops.Clone() }).ToList();
        var route = routes.Single(r => r.Stops.Contains(five));
        int a = Array.IndexOf(route.Stops, five);
        int b = Array.IndexOf(route.Stops, three);
        Assert.True(a >= 0 && b > a, "customer 3 should follow customer 5 on the published route");
        (route.Stops[a], route.Stops[b]) = (route.Stops[b], route.Stops[a]);

        var result = PlanEvaluator.Evaluate(instance, new Plan(routes));

        Assert.False(result.Feasible);
        var v = Assert.Single(result.Violations, x => x.Stop == "5");
        Assert.Equal(RuleKind.TimeWindow, v.Rule);
        Assert.True(v.Hard);
        Assert.True(v.Amount > 0);
    }

    private static int IndexOf(Anneal.Core.Model.Instance instance, string id)
    {
        for (int i = 0; i < instance.StopCount; i++)
        {
            if (instance.Stops[i].Id == id)
            {
                return i;
            }
        }

        throw new InvalidOperationException("no stop " + id);
    }
}
