using System.Text.Json;
using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Core.Plans;
using Anneal.Formats.Input;

namespace Anneal.Tests.Cli;

public sealed class EvaluateCommandTests : CommandTest
{
    private int Evaluate(Plan plan, double capacityKg = 100, string? outDir = null) =>
        EvaluateCommand.Execute(TinyJob.Loaded(TinyJob.Create(capacityKg: capacityKg)), plan, "plan.csv", outDir, new CliContext(Out, Err));

    private static Plan AllOnOneVan => new([new PlannedRoute(0, [2, 0, 1])]);

    [Fact]
    public void A_feasible_plan_exits_0_and_writes_routes_and_summary()
    {
        string outDir = Path.Combine(Dir, "eval");

        Assert.Equal(ExitCodes.Success, Evaluate(AllOnOneVan, outDir: outDir));

        Assert.Contains("Plan: feasible", Out.ToString(), StringComparison.Ordinal);
        Assert.Equal(1 + 1 + 3 + 1, File.ReadAllLines(Path.Combine(outDir, "routes.csv")).Length); // header, depot departure, 3 stops, return
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "summary.json")));
        Assert.Equal(JsonValueKind.Null, summary.RootElement.GetProperty("chosen").ValueKind);
        Assert.Equal(0, summary.RootElement.GetProperty("solvers").GetArrayLength());
        Assert.False(File.Exists(Path.Combine(outDir, "trace.csv")));
    }

    [Fact]
    public void Overloading_a_van_under_hard_capacity_exits_3_and_prints_the_violation()
    {
        // 30 + 40 + 20 kg on a van that carries 80 kg: 10 kg over.
        Assert.Equal(ExitCodes.Infeasible, Evaluate(AllOnOneVan, capacityKg: 80));

        Assert.Contains("INFEASIBLE", Out.ToString(), StringComparison.Ordinal);
        Assert.Contains("hard  capacity", Out.ToString(), StringComparison.Ordinal);
        Assert.Contains("loaded 10 units over", Out.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_stop_planned_twice_is_an_input_problem_of_the_route_file()
    {
        var twice = new Plan([new PlannedRoute(0, [0, 1]), new PlannedRoute(1, [1, 2])]);

        var e = Assert.Throws<InputException>(() => Evaluate(twice));

        Assert.Equal("plan.csv", e.Problems[0].File);
        Assert.Contains("more than once", e.Problems[0].Problem, StringComparison.Ordinal);
    }
}
