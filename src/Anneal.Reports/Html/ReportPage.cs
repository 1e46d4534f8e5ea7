using System.Globalization;
using System.Text;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Output;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>
/// report.html: one self-contained page (pictures inlined as data URIs) that answers which plan, how good, how sure
/// and what breaks, in that order, with the drivers' sheets after it.
/// </summary>
public static class ReportPage
{
    public const string FileName = "report.html";

    public static void Write(string path, ReportInput input) =>
        AtomicFile.WriteText(path, w => w.Write(Build(input)));

    public static string Build(ReportInput input)
    {
        var instance = input.Instance;
        var run = input.Run;
        var h = new StringBuilder(64 * 1024);
        h.Append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">")
            .Append("<title>Plan for ").Append(E(instance.Name)).Append("</title><style>").Append(ReportStyles.Css).Append("</style></head><body>");
        h.Append("<h1>Delivery plan: ").Append(E(instance.Name)).Append("</h1><p class=\"meta\">")
            .Append(E(Path.GetFileName(run.InputPath.TrimEnd('/', '\\')))).Append(" (").Append(E(run.Format)).Append(") · objective ").Append(E(run.Objective))
            .Append(run.Seed is { } seed ? $" · seed {seed}" : string.Empty)
            .Append(run.TimeLimitSeconds is { } t ? " · budget " + Seconds(t) : string.Empty)
            .Append(run.Interrupted ? " · <span class=\"warn\">stopped early by the user</span>" : string.Empty)
            .Append(" · written ").Append(run.GeneratedAt.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture)).Append("</p>");

        Headline(h, input);
        h.Append("<div class=\"advice").Append(input.Plan.Feasible ? string.Empty : " bad").Append("\" id=\"advice\">").Append(E(Advice.For(input))).Append("</div>");

        h.Append("<h2>Solvers</h2>");
        SolverTable.Write(h, input);
        Picture(h, input.Pictures.Convergence, "Best objective over time for each solver (dotted while still breaking a hard rule; ring where it first kept every hard rule).");

        h.Append("<h2>Costs</h2>");
        Breakdown(h, input.Plan.Breakdown);

        if (input.Replan is var (day, changes))
        {
            h.Append("<h2>Changes to the given plan</h2>");
            PlanChanges.Write(h, day, input.Plan, changes);
        }

        h.Append("<h2>What breaks</h2>");
        ProblemLists.Broken(h, input);
        h.Append("<h3>Input screening</h3>");
        ProblemLists.Screening(h, input);

        h.Append("<h2>Maps and schedule</h2>");
        Picture(h, input.Pictures.Routes, "Routes in visiting order, drawn to scale; black squares are depots, red rings late stops, crosses unserved stops.");
        Picture(h, input.Pictures.Schedule, "Each vehicle's day: driving, waiting and service on its first row, then a row per stop with its time windows beside that visit's waiting and service; red is lateness or overtime.");

        h.Append("<h2>Cautions</h2>");
        ProblemLists.Cautions(h);

        h.Append("<h2>Route sheets</h2>");
        RouteSheets.Write(h, input);
        h.Append("</body></html>\n");
        return h.ToString();
    }

    private static void Headline(StringBuilder h, ReportInput input)
    {
        var plan = input.Plan;
        int hard = plan.Violations.Count(v => v.Hard);
        h.Append("<div class=\"cards\" id=\"headline\">");
        Card(h, "objective", Money(plan.Objective), null);
        Card(h, "vehicles used", $"{plan.VehiclesUsed} of {input.Instance.Vehicles.Count}", null);
        Card(h, "distance", Num(plan.Distance, "0.0") + E(input.Instance.Units.DistanceSuffix), null);
        Card(h, "stops served", $"{input.Instance.StopCount - plan.Unserved.Count} of {input.Instance.StopCount}", plan.Unserved.Count > 0 ? "warn" : null);
        Card(h, "hard rules", hard == 0 ? "all kept" : $"{hard} broken", hard == 0 ? "ok" : "bad");
        var bound = Plots.ConvergencePlot.Bound(input.Solvers);
        double? gap = plan.Feasible && bound is { } b ? Traces.TraceFacts.GapPercent(plan.Objective, b.Value) : null;
        Card(h, "optimality", gap is { } g ? (g < 0.005 ? "proved optimal" : $"proved within {Percent(g)} of optimal") : "gap to optimal unknown", gap is null ? "warn" : "ok");
        h.Append("</div>");
    }

    private static void Card(StringBuilder h, string label, string value, string? css) =>
        h.Append("<div class=\"card\"><div class=\"label\">").Append(E(label)).Append("</div><div class=\"value")
            .Append(css is null ? string.Empty : " " + css).Append("\">").Append(value).Append("</div></div>");

    private static void Breakdown(StringBuilder h, CostBreakdown b)
    {
        h.Append("<table id=\"cost-breakdown\"><tbody>");
        foreach (var (label, value) in new[]
        {
            ("vehicle fixed costs", b.Fixed), ("distance", b.Distance), ("driver time", b.Time), ("vehicles (count weight)", b.Vehicles),
            ("late arrivals", b.Lateness), ("overload", b.Overload), ("overtime", b.Overtime), ("over maximum duration", b.DurationExcess),
            ("stops left out", b.Unserved), ("changes to the given plan", b.Stability),
        })
        {
            if (Math.Abs(value) > 1e-9)
            {
                h.Append("<tr><td>").Append(label).Append("</td><td class=\"n\">").Append(Money(value)).Append("</td></tr>");
            }
        }

        h.Append("<tr><th>total</th><th class=\"n\">").Append(Money(b.Total)).Append("</th></tr></tbody></table>");
    }

    private static void Picture(StringBuilder h, byte[]? png, string caption)
    {
        if (png is null)
        {
            return;
        }

        h.Append("<figure><img alt=\"").Append(E(caption)).Append("\" src=\"data:image/png;base64,").Append(Convert.ToBase64String(png))
            .Append("\"><figcaption>").Append(E(caption)).Append("</figcaption></figure>");
    }
}
