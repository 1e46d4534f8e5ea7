using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Formats.Output.Runs;
using Anneal.Reports.Html;

namespace Anneal.Tests.Reports;

/// <summary>The driver's sheet in report.html says what is delivered and what is collected at each stop when the job has pickups.</summary>
public sealed class ReportPickupTests
{
    [Fact]
    public void On_the_returns_demo_each_sheet_shows_what_is_delivered_and_collected_at_each_stop()
    {
        var instance = InputLoader.Load(Path.Combine(BenchmarkData.RepoRoot, "instances", "marl-valley-returns")).Instance;
        int crates = instance.DimensionNames.ToList().IndexOf("crates");
        int collecting = Enumerable.Range(0, instance.StopCount).First(s => instance.Pickup(s, crates) > 0);
        var plan = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [collecting])]));

        string html = Build(instance, plan);

        // The demo's stops.csv: every third shop hands back two crates more than it receives.
        Assert.Contains("<th>delivers</th><th>collects</th>", html, StringComparison.Ordinal);
        Assert.Contains($"{instance.Pickup(collecting, crates):0.##} crates</td>", html, StringComparison.Ordinal);
        Assert.Equal(instance.Demand(collecting, crates) + 2, instance.Pickup(collecting, crates));
    }

    [Fact]
    public void A_pair_names_its_other_stop_and_a_delivery_only_job_has_no_such_columns()
    {
        var instance = RandomInstances.Create(new Random(3), 12, 2, hardWindows: false, pairs: true);
        int c = Enumerable.Range(0, instance.StopCount).First(instance.IsCollection);
        int d = instance.Partner(c);
        var plan = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [c, d])]));

        string html = Build(instance, plan);

        Assert.Contains(" for " + instance.Stops[d].Id + "</td>", html, StringComparison.Ordinal);
        Assert.Contains(" collected at " + instance.Stops[c].Id + "</td>", html, StringComparison.Ordinal);
        var (demo, demoPlan) = ReportFixtures.DemoPlan();
        Assert.DoesNotContain("<th>collects</th>", Build(demo, demoPlan), StringComparison.Ordinal);
    }

    private static string Build(Anneal.Core.Model.Instance instance, PlanEvaluation plan)
    {
        var record = new RunRecord(1, "/x", "csv-job", "cost", RunRecordFile.Routes(instance, plan), [], null, null, null, false, DateTimeOffset.UnixEpoch);
        return ReportPage.Build(new ReportInput(instance, plan, record, [], new ReportPictures(null, null, null)));
    }
}
