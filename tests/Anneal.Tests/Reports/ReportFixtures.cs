using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Travel;
using Anneal.Formats.Input;
using Anneal.Reports.Traces;
using Anneal.Core.Solving;

namespace Anneal.Tests.Reports;

/// <summary>Instances and plans for the picture tests: the small demo job, and a generated 1,000-stop day.</summary>
internal static class ReportFixtures
{
    public static string HarbourSmall => Path.Combine(BenchmarkData.RepoRoot, "instances", "harbour-small");

    public static LoadedInput Demo() => InputLoader.Load(HarbourSmall);

    /// <summary>The demo with a plan: its stops split in order over the fleet (a plain plan is enough to draw).</summary>
    public static (Instance Instance, PlanEvaluation Plan) DemoPlan()
    {
        var instance = Demo().Instance;
        return (instance, PlanEvaluator.Evaluate(instance, Chunks(instance, (instance.StopCount + instance.Vehicles.Count - 1) / instance.Vehicles.Count)));
    }

    /// <summary>The lat/lon demo (one window per stop) with its stops split in order over its three vans.</summary>
    public static (Instance Instance, PlanEvaluation Plan) MerrowdalePlan()
    {
        var instance = InputLoader.Load(Path.Combine(BenchmarkData.RepoRoot, "instances", "merrowdale")).Instance;
        return (instance, PlanEvaluator.Evaluate(instance, Chunks(instance, (instance.StopCount + instance.Vehicles.Count - 1) / instance.Vehicles.Count)));
    }

    /// <summary>1,000 stops in a 60 × 60 km square, minute windows, 100 vans; routes by angle around the depot, ten stops each.</summary>
    public static (Instance Instance, PlanEvaluation Plan) Large()
    {
        const int n = 1000;
        var rng = new Random(5);
        var stops = new List<Stop>(n);
        var x = new double[n + 1];
        var y = new double[n + 1];
        for (int i = 0; i < n; i++)
        {
            x[i] = rng.NextDouble() * 60;
            y[i] = rng.NextDouble() * 60;
            double open = 420 + rng.Next(0, 360);
            stops.Add(new Stop { Id = "s" + i, X = x[i], Y = y[i], Demand = [rng.Next(1, 20)], ServiceTime = 5, Windows = [new TimeWindow(open, open + 90)] });
        }

        x[n] = 30;
        y[n] = 30;
        var vehicles = new List<Vehicle>();
        for (int v = 0; v < 100; v++)
        {
            vehicles.Add(new Vehicle { Id = "van-" + (v + 1), Capacity = [200], ShiftStart = 420, ShiftEnd = 900, FixedCost = 50, CostPerDistance = 0.5, CostPerHour = 20 });
        }

        var rules = new RuleSet { TimeWindows = Rule.Soft(1), ShiftEnd = Rule.Soft(1) };
        var travel = TravelTable.Planar(x, y, roundToInteger: false, timePerDistance: 1.5);
        var instance = new Instance("generated 1000", stops, [new Depot { Id = "hub", X = 30, Y = 30 }], vehicles, ["kg"], [], rules, Objective.Cost, travel, Units.Minutes);
        var order = Enumerable.Range(0, n).OrderBy(i => Math.Atan2(y[i] - 30, x[i] - 30)).ToArray();
        var routes = new List<PlannedRoute>();
        for (int v = 0; v < 100; v++)
        {
            routes.Add(new PlannedRoute(v, order[(v * 10)..((v * 10) + 10)].OrderBy(i => stops[i].Windows[0].Open).ToArray()));
        }

        return (instance, PlanEvaluator.Evaluate(instance, new Plan(routes)));
    }

    /// <summary>Two solvers' made-up traces: one infeasible at first, one with a lower bound.</summary>
    public static IReadOnlyList<SolverRun> Solvers(double best) =>
    [
        new SolverRun("sa", best, true, 3, 100, 10, 8, "completed", null, [],
            [new TracePoint(0, 0, best * 0.9, best * 0.9, false, "construction"), new TracePoint(0.2, 10, best * 1.3, best * 1.3, true, "T=5"),
             new TracePoint(2, 100, best * 1.05, best * 1.1, true, "T=1"), new TracePoint(8, 900, best, best, true, "T=0.1")]),
        new SolverRun("exact", best * 1.02, true, 3, 101, 10, 9, "time limit", best * 0.97, [],
            [new TracePoint(0.5, 1, best * 1.2, best * 1.2, true, string.Empty), new TracePoint(9, 2, best * 1.02, best * 1.02, true, string.Empty)]),
    ];

    private static Plan Chunks(Instance instance, int size)
    {
        var routes = new List<PlannedRoute>();
        for (int v = 0; v * size < instance.StopCount && v < instance.Vehicles.Count; v++)
        {
            routes.Add(new PlannedRoute(v, Enumerable.Range(v * size, Math.Min(size, instance.StopCount - (v * size))).ToArray()));
        }

        return new Plan(routes);
    }
}
