using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Tests.Cli;

/// <summary>
/// `solve --from`, `--now`, `--without` on hand-computed cases. The day is a line: depot at 0, stops s10 … s60 at
/// x = 10 … 60, one minute per km, no service, windows always open, vehicles A and B. The given plan zigzags: A serves
/// s10, s30, s50 (starts 10, 30, 50), B serves s20, s40, s60 (starts 20, 40, 60), both leaving the depot at 0.
/// </summary>
public sealed class ReplanTests : CommandTest
{
    private const string Given = """
        vehicle,kind,stop,start,departure
        A,start,depot,,00:00
        A,stop,s10,00:10,00:10
        A,stop,s30,00:30,00:30
        A,stop,s50,00:50,00:50
        A,end,depot,,
        B,start,depot,,00:00
        B,stop,s20,00:20,00:20
        B,stop,s40,00:40,00:40
        B,stop,s60,01:00,01:00
        B,end,depot,,
        """;

    private CliContext Context() => new(Out, Err) { WorkingDirectory = Dir, Now = () => new DateTime(2026, 3, 4, 11, 20, 0) };

    private static LoadedInput Day(StabilityPrices? prices = null, double capacity = 100, double shiftEnd = 600) => TinyJob.Loaded(TinyInstances.Line(
        [.. Enumerable.Range(1, 6).Select(k => TinyInstances.Stop("s" + (k * 10), k * 10))],
        [TinyInstances.Vehicle("A", capacity, shiftEnd), TinyInstances.Vehicle("B", capacity, shiftEnd)],
        RuleSet.AllHard with { Stability = prices ?? StabilityPrices.Default }));

    private string Plan(string text = Given)
    {
        string path = Path.Combine(Dir, "plan.csv");
        File.WriteAllText(path, text);
        return path;
    }

    private SolveRequest Request(string solvers, string outDir) =>
        new() { Solvers = solvers, TimeSeconds = 5, Iterations = 2000, Quiet = true, OutDir = Path.Combine(Dir, outDir), From = Plan() };

    /// <summary>routes.csv's stop rows per vehicle: (stop, start, status).</summary>
    private static Dictionary<string, List<(string Stop, string Start, string Status)>> Routes(string folder)
    {
        var lines = File.ReadAllLines(Path.Combine(folder, "routes.csv"));
        var header = lines[0].Split(',').ToList();
        var routes = new Dictionary<string, List<(string, string, string)>>();
        foreach (var line in lines.Skip(1))
        {
            var cells = line.Split(',');
            if (cells[header.IndexOf("kind")] != "stop")
            {
                continue;
            }

            string vehicle = cells[header.IndexOf("vehicle")];
            if (!routes.TryGetValue(vehicle, out var list))
            {
                routes[vehicle] = list = [];
            }

            list.Add((cells[header.IndexOf("stop")], cells[header.IndexOf("start")], cells[header.IndexOf("status")]));
        }

        return routes;
    }

    private static List<string[]> Changes(string folder) =>
        [.. File.ReadAllLines(Path.Combine(folder, "changes.csv")).Skip(1).Select(l => l.Split(','))];

    [Theory]
    [InlineData("sa")]
    [InlineData("tabu")]
    [InlineData("ortools")]
    [InlineData("exact")]
    public void Nothing_before_now_changes_whatever_the_solver(string solver)
    {
        // At 00:15 A has served s10 and is driving to s30 (fixed too); B is driving to s20 (fixed). Left: s40, s50, s60.
        int code = SolveCommand.Execute(Day(), Request(solver, solver) with { Now = 15 }, Context());

        Assert.Equal(ExitCodes.Success, code);
        var routes = Routes(Path.Combine(Dir, solver));
        Assert.Equal([("s10", "00:10", "done"), ("s30", "00:30", "in-progress")], routes["A"].Take(2));
        Assert.Equal(("s20", "00:20", "in-progress"), routes["B"][0]);
        var rest = routes.Values.SelectMany(r => r).Select(r => r.Stop).Order();
        Assert.Equal(["s10", "s20", "s30", "s40", "s50", "s60"], rest);
        Assert.All(routes.Values.SelectMany(r => r).Where(r => r.Stop is "s40" or "s50" or "s60"), r => Assert.Equal("planned", r.Status));
    }

    [Fact]
    public void A_very_high_change_price_without_disruption_returns_the_plan_unchanged()
    {
        // The zigzag is far from the shortest plan (one vehicle out and back, 120 km instead of 220), so any search
        // leaves it unless the change prices hold it; at 10^6 per move and 10^4 per minute they do.
        var held = Day(new StabilityPrices(1e6, 1e4, 0));
        int code = SolveCommand.Execute(held, Request("sa", "held"), Context());

        Assert.Equal(ExitCodes.Success, code);
        var routes = Routes(Path.Combine(Dir, "held"));
        Assert.Equal(["s10", "s30", "s50"], routes["A"].Select(r => r.Stop));
        Assert.Equal(["s20", "s40", "s60"], routes["B"].Select(r => r.Stop));
        Assert.Empty(Changes(Path.Combine(Dir, "held")));
        Assert.Contains("0 stops added, 0 cancelled, 0 moved to another van, 0 retimed by more than 0 min", Out.ToString(), StringComparison.Ordinal);

        // The same warm start with the prices off does change the plan: the test can fail.
        SolveCommand.Execute(Day(StabilityPrices.Off), Request("sa", "free"), Context());
        Assert.NotEmpty(Changes(Path.Combine(Dir, "free")));
    }

    [Fact]
    public void A_removed_vehicles_stops_are_all_re_served_or_listed_unserved_with_the_reason()
    {
        // B is taken out at 00:15 before reaching s20: s20, s40, s60 go back into the pool. A (room for 3) has served s10
        // and is driving to s30; the rest of its route can carry 3 of s20, s40, s50 and s60, so one stays unserved.
        int code = SolveCommand.Execute(Day(capacity: 3), Request("sa", "out") with { Now = 15, Without = "B" }, Context());

        Assert.Equal(ExitCodes.Infeasible, code);
        var changes = Changes(Path.Combine(Dir, "out"));
        var moved = changes.Where(c => c[1] == "B").ToList();
        Assert.Equal(["s20", "s40", "s60"], moved.Select(c => c[0]).Order());
        Assert.All(moved, c => Assert.Equal("moved", c[5]));
        Assert.All(moved, c => Assert.True(c[2] == "A" || c[6].Contains("unserved", StringComparison.Ordinal), string.Join(",", c)));
        Assert.All(moved, c => Assert.Contains("vehicle B taken out", c[6], StringComparison.Ordinal));
        Assert.Equal(1, changes.Count(c => c[6].Contains("unserved", StringComparison.Ordinal)));
        Assert.False(Routes(Path.Combine(Dir, "out")).ContainsKey("B"));
    }

    [Fact]
    public void The_report_shows_the_given_and_the_new_plan_side_by_side_for_the_vehicles_that_changed()
    {
        // As above: B taken out at 00:15 gives its three stops up; A takes two of them (room for 3: s30 is fixed) and one stays unserved.
        SolveCommand.Execute(Day(capacity: 3), Request("sa", "report") with { Now = 15, Without = "B" }, Context());

        string page = File.ReadAllText(Path.Combine(Dir, "report", "report.html"));
        Assert.Contains("<h2>Changes to the given plan</h2>", page, StringComparison.Ordinal);
        string table = page[page.IndexOf("<table id=\"plan-changes\">", StringComparison.Ordinal)..];
        table = table[..table.IndexOf("</table>", StringComparison.Ordinal)];
        var rows = table.Split("<tr><td>").Skip(1).ToDictionary(r => r[..r.IndexOf('<')], r => r.Split("</td><td>"));
        Assert.Equal(["A", "B"], rows.Keys.Order());

        // B's given plan as the plan file has it, each stop marked where it went; its new plan keeps nothing.
        string givenB = rows["B"][1];
        Assert.Contains("00:20 s20", givenB, StringComparison.Ordinal);
        Assert.Contains("00:40 s40", givenB, StringComparison.Ordinal);
        Assert.Contains("01:00 s60", givenB, StringComparison.Ordinal);
        Assert.Equal(2, givenB.Split("moved to A").Length - 1);
        Assert.Equal(1, givenB.Split("left unserved").Length - 1);
        Assert.Contains("no stops", rows["B"][2], StringComparison.Ordinal);

        // A's new plan starts with its fixed s10 and s30 (given times) and shows the two stops it took from B.
        string newA = rows["A"][2];
        Assert.StartsWith("<div>00:10 s10</div><div>00:30 s30</div>", newA, StringComparison.Ordinal);
        Assert.Equal(2, newA.Split("from B").Length - 1);
    }

    [Fact]
    public void Cancelled_stops_appear_in_changes_csv()
    {
        var request = Request("sa", "cancelled") with { From = Plan(Given.Replace("B,stop,s60,01:00,01:00", "B,stop,s60,01:00,01:00\nB,stop,s77,01:10,01:10", StringComparison.Ordinal)) };

        SolveCommand.Execute(Day(), request, Context());

        var cancelled = Changes(Path.Combine(Dir, "cancelled")).Single(c => c[0] == "s77");
        Assert.Equal(["s77", "B", "", "01:10", "", "cancelled"], cancelled.Take(6));
        Assert.Contains("1 cancelled", Out.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void The_trace_of_a_warm_start_begins_with_the_given_plan()
    {
        SolveCommand.Execute(Day(StabilityPrices.Off), Request("sa", "trace"), Context());

        // The given plan drives 100 + 120 = 220 km (objective distance).
        var first = File.ReadAllLines(Path.Combine(Dir, "trace", "trace.csv"))[1].Split(',');
        Assert.Equal("sa", first[0]);
        Assert.Equal(220, double.Parse(first[3], System.Globalization.CultureInfo.InvariantCulture), 6);
        Assert.Equal("given plan", first[6]);
    }

    [Fact]
    public void An_unknown_vehicle_a_stop_listed_twice_and_a_now_outside_the_day_are_refused_with_the_row()
    {
        var bad = Request("sa", "bad") with { From = Plan(Given.Replace("B,stop,s40,00:40,00:40", "Z,stop,s40,00:40,00:40\nB,stop,s10,00:45,00:45", StringComparison.Ordinal)) };

        var e = Assert.Throws<InputException>(() => SolveCommand.Execute(Day(), bad, Context()));

        Assert.Contains(e.Problems, p => p is { Row: 9, Column: "vehicle", Value: "Z" });
        Assert.Contains(e.Problems, p => p is { Row: 10, Column: "stop", Value: "s10" } && p.Problem.Contains("row 3", StringComparison.Ordinal));

        var late = Assert.Throws<InputException>(() => SolveCommand.Execute(Day(shiftEnd: 600), Request("sa", "late") with { Now = 700 }, Context()));
        Assert.Equal("--now", late.Problems.Single().File);
        Assert.Equal("11:40", late.Problems.Single().Value);
    }

    [Fact]
    public void The_command_line_exits_2_for_a_bad_plan_and_names_file_row_and_column()
    {
        string job = Path.Combine(BenchmarkData.RepoRoot, "instances", "harbour-small");
        string plan = Plan("vehicle,stop,start\ntruck-1,B01,08:00\ntruck-9,B02,09:00\n");

        int code = CliApp.Run(["solve", job, "--from", plan, "--now", "09:30", "--out", Path.Combine(Dir, "x")], Context());

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("plan.csv, row 3, column 'vehicle'", Err.ToString(), StringComparison.Ordinal);
        Assert.Contains("truck-9", Err.ToString(), StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(Dir, "x")));
    }
}
