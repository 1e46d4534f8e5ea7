using System.Text.RegularExpressions;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Output;
using Anneal.Reports.Html;
using Anneal.Formats.Output.Runs;

namespace Anneal.Tests.Reports;

public sealed partial class ReportTests : TempFolderTest
{
    [Fact]
    public void A_solved_run_leaves_pictures_and_a_report_with_the_solver_table_and_one_sheet_per_vehicle_used()
    {
        string folder = SavedRun.Solve(Dir);

        foreach (var file in Anneal.Reports.RunReport.Files.Append(RunRecordFile.FileName))
        {
            Assert.True(File.Exists(Path.Combine(folder, file)), file);
        }

        string html = File.ReadAllText(Path.Combine(folder, ReportPage.FileName));
        int used = RunRecordFile.Read(Path.Combine(folder, RunRecordFile.FileName)).Routes.Count(r => r.Stops.Count > 0);
        Assert.Contains("id=\"solver-table\"", html, StringComparison.Ordinal);
        Assert.Contains(">insertion", html, StringComparison.Ordinal);
        Assert.Contains(">sa", html, StringComparison.Ordinal);
        Assert.Equal(used, SheetPattern().Count(html));
        Assert.Equal(3, Regex.Count(html, "data:image/png;base64,"));
        Assert.Contains(Cautions.All[2], html, StringComparison.Ordinal);
        Assert.Contains("break-before: page", html, StringComparison.Ordinal);
    }

    [Fact]
    public void User_strings_are_html_encoded()
    {
        var (instance, plan) = Renamed("<b>Ann & Co</b>");
        var record = new RunRecord(1, "/x", "csv-job", "cost", RunRecordFile.Routes(instance, plan), [], null, null, null, false, DateTimeOffset.UnixEpoch);

        string html = ReportPage.Build(new ReportInput(instance, plan, record, [], new ReportPictures(null, null, null)));

        Assert.Contains("&lt;b&gt;Ann &amp; Co&lt;/b&gt;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<b>Ann", html, StringComparison.Ordinal);
    }

    [Fact]
    public void The_headline_says_in_words_what_the_plan_costs_how_soon_it_was_near_and_the_proven_gap()
    {
        var (demo, _) = ReportFixtures.DemoPlan();
        var instance = demo.With(rules: new RuleSet { TimeWindows = Rule.Soft(1), Capacity = Rule.Soft(1), ShiftEnd = Rule.Soft(1), MaxDuration = Rule.Soft(1) });
        var plan = PlanEvaluator.Evaluate(instance, new Anneal.Core.Plans.Plan([new Anneal.Core.Plans.PlannedRoute(0, [.. Enumerable.Range(0, instance.StopCount)])]));
        var solvers = ReportFixtures.Solvers(1000);
        var record = new RunRecord(1, "/x", "csv-job", "cost", RunRecordFile.Routes(instance, plan), [], "sa", 1, 10, false, DateTimeOffset.UnixEpoch);

        string advice = Advice.For(new ReportInput(instance, plan, record, solvers, new ReportPictures(null, null, null)));

        // The plan keeps every hard rule (all are soft here but serving). sa's trace is at 1050 (5% above) at 2 s and at 1000 at 8 s; the bound 970 gives (1000-970)/1000 = 3%.
        Assert.Equal("sa's plan costs 1,000.00; it was within 1% of that after 8.0 s; exact proved that no plan is more than 3.0% cheaper.", advice);
    }

    [Fact]
    public void On_a_day_that_cannot_be_fully_served_the_headline_says_what_cannot_be_done_and_why()
    {
        var (demo, _) = ReportFixtures.DemoPlan();
        var vans = demo.Vehicles.Select(v => v with { Capacity = [100] }).ToList(); // 15 berths, far more than 300 kg
        var instance = demo.With(vehicles: vans);
        var plan = PlanEvaluator.Evaluate(instance, Anneal.Search.Construction.Salvage.Drivable(instance, new Anneal.Core.Plans.Plan([])));
        var solvers = ReportFixtures.Solvers(1000).Select(s => s with { Feasible = false }).ToList();
        var record = new RunRecord(1, "/x", "csv-job", "cost", RunRecordFile.Routes(instance, plan), [], "sa", 1, 10, false, DateTimeOffset.UnixEpoch);

        string advice = Advice.For(new ReportInput(instance, plan, record, solvers, new ReportPictures(null, null, null)));

        int served = instance.StopCount - plan.Unserved.Count;
        Assert.StartsWith("No plan can keep every hard rule: the day's 1,737 kg exceed the fleet's 300 kg", advice, StringComparison.Ordinal);
        Assert.Contains($"The plan below, sa's, serves {served} of 15 stops", advice, StringComparison.Ordinal);
    }

    private static (Instance, PlanEvaluation) Renamed(string stopId)
    {
        var (instance, _) = ReportFixtures.DemoPlan();
        var stops = instance.Stops.Select((s, i) => i == 0 ? s with { Id = stopId } : s).ToList();
        var renamed = new Instance(instance.Name + " " + stopId, stops, instance.Depots, instance.Vehicles, instance.DimensionNames, instance.EquipmentNames,
            instance.Rules, instance.Objective, instance.Travel, instance.Units);
        var plan = new Anneal.Core.Plans.Plan([new Anneal.Core.Plans.PlannedRoute(0, [0, 1])]);
        return (renamed, PlanEvaluator.Evaluate(renamed, plan));
    }

    [GeneratedRegex("<section class=\"sheet\"")]
    private static partial Regex SheetPattern();
}
