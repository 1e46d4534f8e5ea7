using System.Text;
using Anneal.Reports.Plots;
using Anneal.Reports.Traces;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>
/// One row per solver: final objective, feasibility, how fast it got within 1% of its own final value, bound and gap
/// to the strongest bound. Narrow columns so the table fits a printed page; a solver without a plan (one that found
/// none, or proves bounds only) shows a dash, never a number.
/// </summary>
internal static class SolverTable
{
    public const char NoValue = '—';

    public static void Write(StringBuilder h, ReportInput input)
    {
        if (input.Solvers.Count == 0)
        {
            h.Append("<p class=\"none\">No search was run: the plan was given.</p>");
            return;
        }

        var bound = ConvergencePlot.Bound(input.Solvers);
        h.Append("<table id=\"solver-table\"><thead><tr><th>solver</th><th class=\"n\">objective</th><th>feasible</th><th class=\"n\">vehicles</th>")
            .Append("<th class=\"n\">distance</th><th class=\"n\">within 1% after</th><th class=\"n\">best at / ran</th>")
            .Append("<th class=\"n\">lower bound</th><th class=\"n\">gap to bound</th><th>status</th></tr></thead><tbody>");
        foreach (var s in input.Solvers)
        {
            bool chosen = s.Solver == input.Run.Chosen;
            h.Append(chosen ? "<tr class=\"chosen\">" : "<tr>")
                .Append("<td>").Append(E(s.Solver)).Append(chosen ? " (chosen)" : string.Empty).Append("</td>");
            if (s.Objective is { } objective)
            {
                double? within = TraceFacts.SecondsToWithin(s.Trace, objective, s.Feasible, Advice.Within);
                h.Append("<td class=\"n\">").Append(Money(objective)).Append("</td>")
                    .Append(s.Feasible ? "<td class=\"ok\">yes</td>" : "<td class=\"bad\">no</td>")
                    .Append("<td class=\"n\">").Append(s.Vehicles).Append("</td>")
                    .Append("<td class=\"n\">").Append(Num(s.Distance ?? double.NaN, "#,0.0")).Append(E(input.Instance.Units.DistanceSuffix)).Append("</td>")
                    .Append("<td class=\"n\">").Append(within is { } w ? Seconds(w) : NoValue.ToString()).Append("</td>")
                    .Append("<td class=\"n\">").Append(Seconds(s.SecondsToBest)).Append(" / ").Append(Seconds(s.Seconds)).Append("</td>");
            }
            else
            {
                h.Append("<td class=\"n\">").Append(NoValue).Append("</td><td class=\"bad\">no plan</td><td class=\"n\">").Append(NoValue)
                    .Append("</td><td class=\"n\">").Append(NoValue).Append("</td><td class=\"n\">").Append(NoValue)
                    .Append("</td><td class=\"n\">").Append(NoValue).Append(" / ").Append(Seconds(s.Seconds)).Append("</td>");
            }

            double? gap = bound is { } b && s.Objective is { } o && s.Feasible ? TraceFacts.GapPercent(o, b.Value) : null;
            h.Append("<td class=\"n\">").Append(s.LowerBound is { } lb ? Money(lb) : NoValue.ToString()).Append("</td>")
                .Append("<td class=\"n\">").Append(gap is { } g ? Percent(g) : NoValue.ToString()).Append("</td>")
                .Append("<td class=\"status\">").Append(E(s.Status)).Append("</td></tr>");
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
