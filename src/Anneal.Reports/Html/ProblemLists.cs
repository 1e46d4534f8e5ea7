using System.Text;
using Anneal.Core.Evaluation;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>What breaks: broken rules (hard first), unserved stops, the input screening's findings, and the standing cautions.</summary>
internal static class ProblemLists
{
    public static void Broken(StringBuilder h, ReportInput input)
    {
        var hard = input.Plan.Violations.Where(v => v.Hard && v.Rule != RuleKind.Unserved).ToList();
        var soft = input.Plan.Violations.Where(v => !v.Hard && v.Rule != RuleKind.Unserved).ToList();
        if (hard.Count == 0 && soft.Count == 0)
        {
            h.Append("<p class=\"ok\">No rule is broken.</p>");
        }

        List(h, "Hard rules broken (the plan cannot be driven as it is)", "bad", hard.Select(v => v.Message));
        List(h, "Soft rules broken (allowed, at their price)", "warn", soft.Select(v => v.Message));

        var unserved = input.Plan.Violations.Where(v => v.Rule == RuleKind.Unserved).Select(v => v.Message).ToList();
        h.Append("<h3>Unserved stops</h3>");
        if (unserved.Count == 0)
        {
            h.Append("<p class=\"ok\">Every stop is served.</p>");
        }
        else
        {
            List(h, null, null, unserved);
        }
    }

    public static void Screening(StringBuilder h, ReportInput input)
    {
        var obstacles = input.Obstacles;
        if (obstacles.Count == 0)
        {
            h.Append("<p class=\"ok\">The screening found nothing that rules out serving every stop (capacity, equipment, windows, shifts, durations).</p>");
            return;
        }

        h.Append("<p class=\"warn\">The day cannot be fully served, whatever the plan:</p><ul class=\"plain\" id=\"screening\">");
        foreach (var o in obstacles)
        {
            h.Append("<li>").Append(E(o.Message)).Append("</li>");
        }

        h.Append("</ul>");
    }

    public static void Cautions(StringBuilder h)
    {
        h.Append("<ul class=\"plain\">");
        foreach (var c in Anneal.Formats.Output.Cautions.All)
        {
            h.Append("<li>").Append(E(c)).Append("</li>");
        }

        h.Append("</ul>");
    }

    private static void List(StringBuilder h, string? title, string? css, IEnumerable<string> items)
    {
        var list = items.ToList();
        if (list.Count == 0)
        {
            return;
        }

        if (title is not null)
        {
            h.Append("<h3 class=\"").Append(css).Append("\">").Append(E(title)).Append(" (").Append(list.Count).Append(")</h3>");
        }

        h.Append("<ul class=\"plain\">");
        foreach (var item in list)
        {
            h.Append("<li>").Append(E(item)).Append("</li>");
        }

        h.Append("</ul>");
    }
}
