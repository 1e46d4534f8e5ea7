using Anneal.Cli;
using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.Csv;
using Anneal.Tests.Formats.Input.Ranges;

namespace Anneal.Tests.Cli;

/// <summary>
/// Rules that vanished (issue 19): the demo's own <c>"unserved": {"hard": true, "pricePerStop": 250}</c> dropped the
/// price, so an optional stop without a penalty was left out for free. Now the price is that of leaving out such a
/// stop, and `check` says what every rule means and warns about settings that would do nothing.
/// </summary>
public sealed class CheckRulesTests : CommandTest
{
    private const string HardUnservedPriced = """{ "rules": { "unserved": { "hard": true, "pricePerStop": 250 } } }""";

    [Fact]
    public void A_hard_unserved_rule_prices_an_optional_stop_without_its_own_penalty()
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = HardUnservedPriced;
        files["stops.csv"] = RangeTests.SetCell(files["stops.csv"], 4, "optional", "yes"); // s3: optional, no penalty
        using var job = new JobFolder(files);

        var instance = CsvJobReader.Read(job.Path).Instance;

        Assert.True(instance.Rules.Unserved.Hard);
        Assert.Equal(250, instance.UnservedPrice(2));
        Assert.Equal(90, instance.UnservedPrice(1)); // s2's own penalty comes first
        Assert.False(instance.MayDrop(0));

        // Leaving s3 out of a plan that serves s1 and s2 costs its 250 in the evaluator, the one truth for costs.
        var plan = new Plan([new PlannedRoute(0, [0, 1])]);
        var judged = PlanEvaluator.Evaluate(instance, plan);
        Assert.Equal(250, judged.Breakdown.Unserved);
        Assert.Contains(judged.Violations, v => v.Message.Contains("left unserved (penalty 250)", StringComparison.Ordinal));
    }

    [Fact]
    public void Check_says_what_each_rule_means()
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = HardUnservedPriced;

        string text = Check(files);
        Assert.Contains("unserved: hard: every mandatory stop is served; an optional stop is left out at its own penalty, or else at 250", text, StringComparison.Ordinal);
        Assert.Contains("time windows: hard: service starts within a window", text, StringComparison.Ordinal);
        Assert.Contains("equipment: hard (always)", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_warns_about_free_optional_stops_unused_prices_dimensions_without_demand_and_one_way_matrix_pairs()
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = """{ "rules": { "timeWindows": { "hard": true, "pricePerMinute": 3 } } }""";
        files["stops.csv"] = RangeTests.SetCell(files["stops.csv"], 4, "optional", "yes");
        files["stops.csv"] = files["stops.csv"].Replace(",demand_m3", string.Empty, StringComparison.Ordinal)
            .Replace(",1.5,", ",", StringComparison.Ordinal).Replace("20,,", "20,", StringComparison.Ordinal).Replace(",0.5,", ",", StringComparison.Ordinal);
        var ids = new[] { "s1", "s2", "s3", "hub" };
        var lines = new List<string> { "from,to,distance,duration" };
        for (int a = 0; a < ids.Length; a++)
        {
            for (int b = 0; b < ids.Length; b++)
            {
                if (a != b && (a < b || (a, b) == (3, 0)))
                {
                    lines.Add($"{ids[a]},{ids[b]},5,10"); // every pair one way; hub,s1 both ways
                }
            }
        }

        files["matrix.csv"] = string.Join('\n', lines) + "\n";

        string text = Check(files);
        Assert.Contains("warning: 1 stop(s) may be left out at no cost (s3)", text, StringComparison.Ordinal);
        Assert.Contains("warning: time windows is hard, so its price 3 per min late is not used", text, StringComparison.Ordinal);
        Assert.Contains("warning: no stop has a demand in m3 (is a demand_m3 column missing?)", text, StringComparison.Ordinal);
        Assert.Contains("warning: matrix.csv: 5 pair(s) are given in one direction only", text, StringComparison.Ordinal);
    }

    [Fact]
    public void A_cost_objective_without_any_price_is_warned_about_by_check_and_solve()
    {
        // Issue 17: with no fixed_cost, cost_per_km or cost_per_hour anywhere, every route costs 0.
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = """{ "objective": "cost" }""";
        files["vehicles.csv"] = files["vehicles.csv"].Replace(",50,0.4,22,", ",,,,", StringComparison.Ordinal).Replace(",70,0.5,25,", ",0,0,0,", StringComparison.Ordinal);
        const string Blind = "warning: the objective is cost, but no vehicle has a fixed_cost, cost_per_km or cost_per_hour";

        Assert.Contains(Blind, Check(files), StringComparison.Ordinal);

        using (var job = new JobFolder(files))
        {
            int code = CliApp.Run(["solve", job.Path, "--solvers", "insertion", "--out", Path.Combine(Dir, "run"), "--quiet"], Out, Err);
            Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, Err.ToString());
            Assert.Contains(Blind, Err.ToString(), StringComparison.Ordinal);
        }

        // One price anywhere, or another objective, lets the objective tell plans apart: no warning.
        files["vehicles.csv"] = files["vehicles.csv"].Replace(",0,0,0,", ",0,0.1,0,", StringComparison.Ordinal);
        Assert.DoesNotContain(Blind, Check(files), StringComparison.Ordinal);
        files["vehicles.csv"] = files["vehicles.csv"].Replace(",0,0.1,0,", ",0,0,0,", StringComparison.Ordinal);
        files["settings.json"] = """{ "objective": "distance" }""";
        Assert.DoesNotContain(Blind, Check(files), StringComparison.Ordinal);
    }

    [Fact]
    public void Negative_rule_prices_are_refused()
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = """{ "rules": { "unserved": { "hard": true, "pricePerStop": -5 } } }""";
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        Assert.Equal("rules.unserved.pricePerStop", Assert.Single(e.Problems).JsonPath);
    }

    /// <summary>`anneal check` on the job; it must be valid (warnings do not change the exit code).</summary>
    private string Check(Dictionary<string, string> files)
    {
        using var job = new JobFolder(files);
        Out.GetStringBuilder().Clear();
        Assert.Equal(ExitCodes.Success, CliApp.Run(["check", job.Path], Out, Err));
        return Out.ToString();
    }
}
