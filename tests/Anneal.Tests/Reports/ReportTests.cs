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
    public void The_advice_names_the_fastest_solver_and_the_proven_gap()
    {
        var (instance, plan) = ReportFixtures.DemoPlan();
        var solvers = ReportFixtures.Solvers(1000);
        var record = new RunRecord(1, "/x", "csv-job", "cost", RunRecordFile.Routes(instance, plan), [], "sa", 1, 10, false, DateTimeOffset.UnixEpoch);

        string advice = Advice.For(new ReportInput(instance, plan, record, solvers, new ReportPictures(null, null, null)));

        // exact is at 1020 (within 1% of 1000? no: 2%), sa reaches 1000 at 8 s; the bound 970 gives (1000-970)/1000 = 3%.
        Assert.Contains("sa found it in 8.0 s", advice, StringComparison.Ordinal);
        Assert.Contains("exact proved the best is at most 3.0% from optimal", advice, StringComparison.Ordinal);
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
