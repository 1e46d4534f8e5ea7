using System.Text;
using Anneal.Reports.Plots;
using Anneal.Reports.Traces;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>One row per solver: final objective, feasibility, how fast it got within 1% of its own final value, bound and gap.</summary>
internal static class SolverTable
{
    /// <summary>A solver that only proves bounds has no plan: its row shows the bound and when it was reached.</summary>
    private static void BoundRow(StringBuilder h, SolverRun s) =>
        h.Append("<tr class=\"bound\"><td>").Append(E(s.Solver)).Append("</td><td class=\"n\">–</td><td>no plan</td><td class=\"n\">–</td><td class=\"n\">–</td><td class=\"n\">–</td>")
            .Append("<td class=\"n\">").Append(Seconds(s.SecondsToBest)).Append("</td>")
            .Append("<td class=\"n\">").Append(Seconds(s.Seconds)).Append("</td>")
            .Append("<td class=\"n\">").Append(s.LowerBound is { } lb ? Money(lb) : "–").Append("</td><td class=\"n\">–</td>")
            .Append("<td>").Append(E(s.Status)).Append("</td></tr>");

    public static void Write(StringBuilder h, ReportInput input)
    {
        if (input.Solvers.Count == 0)
        {
            h.Append("<p class=\"none\">No search was run: the plan was given.</p>");
            return;
        }

        var bound = ConvergencePlot.Bound(input.Solvers);
        h.Append("<table id=\"solver-table\"><thead><tr><th>solver</th><th class=\"n\">final objective</th><th>feasible</th><th class=\"n\">vehicles</th>")
            .Append("<th class=\"n\">distance</th><th class=\"n\">within 1% after</th><th class=\"n\">best at</th><th class=\"n\">ran</th>")
            .Append("<th class=\"n\">lower bound</th><th class=\"n\">gap to bound</th><th>status</th></tr></thead><tbody>");
        foreach (var s in input.Solvers)
        {
            if (s.BoundOnly)
            {
                BoundRow(h, s);
                continue;
            }

            double? within = TraceFacts.SecondsToWithin(s.Trace, s.Objective, s.Feasible, Advice.Within);
            double? gap = bound is { } b ? TraceFacts.GapPercent(s.Objective, b.Value) : null;
            bool chosen = s.Solver == input.Run.Chosen;
            h.Append(chosen ? "<tr class=\"chosen\">" : "<tr>")
                .Append("<td>").Append(E(s.Solver)).Append(chosen ? " (chosen)" : string.Empty).Append("</td>")
                .Append("<td class=\"n\">").Append(Money(s.Objective)).Append("</td>")
                .Append(s.Feasible ? "<td class=\"ok\">yes</td>" : "<td class=\"bad\">no</td>")
                .Append("<td class=\"n\">").Append(s.Vehicles).Append("</td>")
                .Append("<td class=\"n\">").Append(Num(s.Distance, "0.0")).Append(E(input.Instance.Units.DistanceSuffix)).Append("</td>")
                .Append("<td class=\"n\">").Append(within is { } w ? Seconds(w) : "–").Append("</td>")
                .Append("<td class=\"n\">").Append(Seconds(s.SecondsToBest)).Append("</td>")
                .Append("<td class=\"n\">").Append(Seconds(s.Seconds)).Append("</td>")
                .Append("<td class=\"n\">").Append(s.LowerBound is { } lb ? Money(lb) : "–").Append("</td>")
                .Append("<td class=\"n\">").Append(gap is { } g && s.Feasible ? Percent(g) : "–").Append("</td>")
                .Append("<td>").Append(E(s.Status)).Append("</td></tr>");
        }

        h.Append("</tbody></table>");

        foreach (var s in input.Solvers)
        {
            foreach (var note in s.Notes)
            {
                h.Append("<p class=\"meta\">").Append(E(s.Solver)).Append(": ").Append(E(note)).Append("</p>");
            }
        }
    }
}
