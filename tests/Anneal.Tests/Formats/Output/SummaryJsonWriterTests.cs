using System.Text.Json;
using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Output;

namespace Anneal.Tests.Formats.Output;

public sealed class SummaryJsonWriterTests : TempFolderTest
{
    [Fact]
    public void The_summary_parses_and_has_every_documented_field()
    {
        var instance = TinyJob.Create();
        var evaluation = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [0, 1])]));
        var document = new SummaryDocument(
            instance.Name, "csv-job", "cost", SummaryJsonWriter.Describe(instance, evaluation),
            [new ObstacleSummary("capacity", null, "the day's 90 kg exceed the fleet's 80 kg")],
            [new SolverSummary("insertion", evaluation.Objective, evaluation.Distance, 1, evaluation.Feasible, 0.1, 0.2, "completed", null, [])],
            "insertion", 7, 5, false, Cautions.All, new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));
        string path = Path.Combine(Dir, SummaryJsonWriter.FileName);

        SummaryJsonWriter.Write(path, document);

        using var json = JsonDocument.Parse(File.ReadAllText(path));
        var root = json.RootElement;
        foreach (var field in new[] { "instance", "format", "objectiveKind", "plan", "screening", "solvers", "chosen", "seed", "timeLimitSeconds", "interrupted", "cautions", "generatedAt" })
        {
            Assert.True(root.TryGetProperty(field, out _), field);
        }

        var plan = root.GetProperty("plan");
        foreach (var field in new[] { "objective", "distance", "duration", "vehicles", "feasible", "unserved", "breakdown", "violations", "unservedStops" })
        {
            Assert.True(plan.TryGetProperty(field, out _), "plan." + field);
        }

        foreach (var field in new[] { "fixed", "distance", "time", "vehicles", "lateness", "overload", "overtime", "durationExcess", "unserved", "total" })
        {
            Assert.True(plan.GetProperty("breakdown").TryGetProperty(field, out _), "breakdown." + field);
        }

        var solver = root.GetProperty("solvers")[0];
        foreach (var field in new[] { "solver", "objective", "distance", "vehicles", "feasible", "secondsToBest", "seconds", "status", "lowerBound", "notes" })
        {
            Assert.True(solver.TryGetProperty(field, out _), "solvers[0]." + field);
        }

        Assert.Equal(JsonValueKind.Null, solver.GetProperty("lowerBound").ValueKind);
        var obstacle = root.GetProperty("screening")[0];
        Assert.Equal("capacity", obstacle.GetProperty("rule").GetString());
        Assert.Equal(JsonValueKind.Null, obstacle.GetProperty("stop").ValueKind);
        Assert.Equal("the day's 90 kg exceed the fleet's 80 kg", obstacle.GetProperty("message").GetString());
        Assert.Equal(["C"], plan.GetProperty("unserved").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal("unserved", plan.GetProperty("violations")[0].GetProperty("rule").GetString());
        Assert.Equal(Cautions.All.Count, root.GetProperty("cautions").GetArrayLength());
        Assert.Equal("2026-01-02T03:04:05+00:00", root.GetProperty("generatedAt").GetString());

        // The total is the sum of the parts (CostBreakdown.Total's definition), and equals the plan's objective.
        var b = plan.GetProperty("breakdown");
        double sum = 0;
        foreach (var part in new[] { "fixed", "distance", "time", "vehicles", "lateness", "overload", "overtime", "durationExcess", "unserved" })
        {
            sum += b.GetProperty(part).GetDouble();
        }

        Assert.Equal(b.GetProperty("total").GetDouble(), sum, 9);
        Assert.Equal(plan.GetProperty("objective").GetDouble(), sum, 9);
    }
}
