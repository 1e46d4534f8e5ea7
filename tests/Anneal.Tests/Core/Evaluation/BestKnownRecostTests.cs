using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Tests.Core.Evaluation;

/// <summary>
/// The evaluator re-costs the published best-known routes and must agree with ../shared/benchmarks/bks.csv:
/// the value column to 0.01, the vehicles column exactly, and every hard rule kept.
/// </summary>
public class BestKnownRecostTests
{
    [SkippableTheory]
    [InlineData("solomon", "c101")]
    [InlineData("solomon", "c105")]
    [InlineData("solomon", "c201")]
    [InlineData("solomon", "c205")]
    [InlineData("solomon", "r101")]
    [InlineData("solomon", "r105")]
    [InlineData("solomon", "r201")]
    [InlineData("solomon", "r205")]
    [InlineData("solomon", "rc101")]
    [InlineData("solomon", "rc105")]
    [InlineData("solomon", "rc201")]
    [InlineData("solomon", "rc205")]
    [InlineData("homberger", "c1_2_1")]
    [InlineData("homberger", "r1_2_1")]
    [InlineData("homberger", "rc1_2_1")]
    public void Vrptw_vehicles_first_routes_match_the_published_value(string set, string name)
    {
        // Source: bks.csv, objective vehicles-first, distance rule euclidean-double (SINTEF TOP best-known tables).
        var expected = BestKnownValues.Find(name, "vehicles-first", "euclidean-double");
        var instance = SolomonReader.Parse(File.ReadAllText(BenchmarkData.File($"{set}/{name}.txt")), name + ".txt");
        var plan = RouteFileReader.Read(BenchmarkData.File($"{set}/{name}.vehicles-first.sol"), instance);

        Check(instance, plan, expected);
    }

    [SkippableTheory]
    [InlineData("lc101")]
    [InlineData("lc201")]
    [InlineData("lr101")]
    [InlineData("lr201")]
    [InlineData("lrc101")]
    [InlineData("lrc201")]
    [InlineData("lc1_2_1")]
    [InlineData("lr1_2_1")]
    [InlineData("lrc1_2_1")]
    public void Pickup_and_delivery_routes_match_the_published_value(string name)
    {
        // Source: bks.csv, objective vehicles-first, euclidean-double (SINTEF TOP table of best-known solutions for the
        // Li & Lim benchmark). The value column is the distance; the evaluator must find every pair on one route, collected first.
        var expected = BestKnownValues.Find(name, "vehicles-first", "euclidean-double");
        var instance = LiLimReader.Parse(File.ReadAllText(BenchmarkData.File($"lilim/{name}.txt")), name + ".txt");
        var plan = RouteFileReader.Read(BenchmarkData.File($"lilim/{name}.vehicles-first.sol"), instance);

        Check(instance.With(objective: Objective.Distance), plan, expected);
    }

    [SkippableTheory]
    [InlineData("A-n32-k5")]
    [InlineData("X-n101-k25")]
    public void Cvrp_routes_match_the_published_value(string name)
    {
        // Source: bks.csv, objective distance-only, TSPLIB EUC_2D rounding (CVRPLIB optimal values). Plain distance.
        var expected = BestKnownValues.Find(name, "distance-only", "euclidean-rounded");
        var instance = CvrplibReader.Parse(File.ReadAllText(BenchmarkData.File($"cvrp/{name}.vrp")), name + ".vrp");
        var plan = RouteFileReader.Read(BenchmarkData.File($"cvrp/{name}.sol"), instance);

        Check(instance, plan, expected);
    }

    private static void Check(Instance instance, Anneal.Core.Plans.Plan plan, BestKnown expected)
    {
        var result = PlanEvaluator.Evaluate(instance, plan);

        Assert.True(result.Feasible, $"{expected.Instance}: published routes judged infeasible: " + string.Join("; ", result.Violations.Select(v => v.Message)));
        Assert.Empty(result.Unserved);
        Assert.True(Math.Abs(result.Objective - expected.Value) <= 0.01,
            $"{expected.Instance}: re-costed {result.Objective:F4}, bks.csv 'value' column says {expected.Value} ({expected.DistanceRule}; {expected.Source})");
        Assert.True(result.VehiclesUsed == expected.Vehicles,
            $"{expected.Instance}: {result.VehiclesUsed} vehicles used, bks.csv 'vehicles' column says {expected.Vehicles}");
    }
}
