using System.Text.Json;
using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.Csv;

namespace Anneal.Tests.Cli;

/// <summary>
/// A day that cannot be fully served, as a coordinator meets it: `check` says so and why (exit 3), `solve` still writes
/// the plan that serves what can be served, names why the rest cannot, and never passes off a solver without a plan.
/// </summary>
public sealed class InfeasibleDayTests : CommandTest
{
    /// <summary>TinyJob with stop C at 120 kg: more than either 100 kg van carries.</summary>
    private static Instance TooHeavy()
    {
        var tiny = TinyJob.Create();
        var stops = tiny.Stops.Select(s => s.Id == "C" ? s with { Demand = [120, 1] } : s).ToList();
        return new Instance(tiny.Name, stops, tiny.Depots, tiny.Vehicles, tiny.DimensionNames, tiny.EquipmentNames, tiny.Rules, tiny.Objective, tiny.Travel, tiny.Units);
    }

    [Fact]
    public void Check_says_valid_but_cannot_be_fully_served_and_why_with_exit_3()
    {
        var files = JobFolder.ValidPlanar();
        files["vehicles.csv"] = "id,count,depot,capacity_kg,capacity_m3\nvan,1,hub,20,8\n"; // 35 kg of demand, one 20 kg van
        files["stops.csv"] = "id,x,y,demand_kg,demand_m3\ns1,3,4,10,1\ns2,6,8,20,1\ns3,0,10,5,1\n";
        files.Remove("settings.json");
        using var job = new JobFolder(files);

        int code = CheckCommand.Execute(job.Path, new CliContext(Out, Err));

        Assert.Equal(ExitCodes.Infeasible, code);
        string text = Out.ToString();
        Assert.Matches(@": valid \(csv-job[^)]*\), but cannot be fully served: 1 reason\n", text.ReplaceLineEndings("\n"));
        Assert.Contains("  - the day's 35 kg exceed the fleet's 20 kg", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_of_a_job_that_fits_exits_0()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());
        Assert.Equal(ExitCodes.Success, CheckCommand.Execute(job.Path, new CliContext(Out, Err)));
        Assert.Matches(@": valid \(csv-job[^)]*\)\n", Out.ToString().ReplaceLineEndings("\n"));
        Assert.DoesNotContain("cannot be fully served", Out.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Solve_writes_what_can_be_served_says_why_not_the_rest_and_never_chooses_a_solver_without_a_plan()
    {
        string outDir = Path.Combine(Dir, "run");
        var request = new SolveRequest { Solvers = "bound,insertion", TimeSeconds = 2, Iterations = 200, OutDir = outDir, Quiet = true };

        int code = SolveCommand.Execute(TinyJob.Loaded(TooHeavy()), request, new CliContext(Out, Err) { WorkingDirectory = Dir });

        Assert.Equal(ExitCodes.Infeasible, code);
        string text = Out.ToString();
        Assert.Contains("Chosen: insertion", text, StringComparison.Ordinal);
        Assert.Contains("  - stop C needs 120 kg; the largest vehicle carries 100 kg", text, StringComparison.Ordinal);
        Assert.Matches(@"bound\s+lower bound\s+\S+\s+\(no plan\)", text);

        // The routes hold A and B, each on a route that keeps every hard rule; C is the one left out.
        var rows = File.ReadAllLines(Path.Combine(outDir, "routes.csv")).Skip(1).Select(l => l.Split(',')).ToList();
        Assert.Equal(["A", "B"], rows.Where(r => r[2] == "stop").Select(r => r[3]).Order());

        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "summary.json")));
        var root = summary.RootElement;
        Assert.Equal("insertion", root.GetProperty("chosen").GetString());
        Assert.Equal(["C"], root.GetProperty("plan").GetProperty("unserved").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal("stop C needs 120 kg; the largest vehicle carries 100 kg", root.GetProperty("screening")[0].GetProperty("message").GetString());
        var bound = root.GetProperty("solvers").EnumerateArray().Single(s => s.GetProperty("solver").GetString() == "bound");
        foreach (var field in new[] { "objective", "vehicles", "distance" })
        {
            Assert.Equal(JsonValueKind.Null, bound.GetProperty(field).ValueKind);
        }
    }
}
