using System.Text;
using Anneal.Core.Replanning;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>
/// A re-plan's section of report.html: the summary of the changes, then for each vehicle whose stops changed (one moved
/// on or off it, a new stop on it, one retimed beyond the tolerance) its given plan and its new plan side by side,
/// stop by stop with start times; what left the route is marked in the given column, what came onto it in the new one.
/// </summary>
internal static class PlanChanges
{
    /// <param name="residual">The written plan of the residual instance (the rest of the day).</param>
    public static void Write(StringBuilder h, ResidualDay day, Core.Evaluation.PlanEvaluation residual, DayChanges changes)
    {
        var job = day.Day;
        h.Append("<p>").Append(E(changes.Summary(job.Units.TimeWords))).Append(" (from ").Append(E(Path.GetFileName(day.Request.Plan.File)))
            .Append(day.Request.Now is double now ? " at " + E(job.Units.Format(now)) : " as a warm start").Append("; changes.csv lists each).</p>");

        var changed = new SortedSet<string>(StringComparer.Ordinal);
        var why = new Dictionary<string, StopChange>(StringComparer.Ordinal);
        foreach (var c in changes.Stops)
        {
            why[c.Stop] = c;
            if (c.OldVehicle is { } o)
            {
                changed.Add(o);
            }

            if (c.NewVehicle is { } n)
            {
                changed.Add(n);
            }
        }

        if (changed.Count == 0)
        {
            h.Append("<p>No vehicle's stops changed.</p>");
            return;
        }

        var given = new Dictionary<string, List<(string Stop, double? Start)>>(StringComparer.Ordinal);
        foreach (var route in day.Request.Plan.Routes)
        {
            var list = Route(given, job.Vehicles[route.Vehicle].Id);
            foreach (var v in route.Visits)
            {
                list.Add((v.StopId, v.Start));
            }
        }

        var planned = new Dictionary<string, List<(string Stop, double? Start)>>(StringComparer.Ordinal);
        foreach (var part in day.Fixed)
        {
            var list = Route(planned, job.Vehicles[part.Vehicle].Id);
            foreach (var v in part.Visits)
            {
                list.Add((v.StopId, v.Start));
            }
        }

        foreach (var route in residual.Routes)
        {
            var list = Route(planned, job.Vehicles[day.DayVehicle[route.Vehicle]].Id);
            for (int k = 0; k < route.Stops.Length; k++)
            {
                list.Add((job.Stops[day.DayStop[route.Stops[k]]].Id, route.Visits[k].Start));
            }
        }

        h.Append("<table id=\"plan-changes\"><thead><tr><th>vehicle</th><th>given plan</th><th>new plan</th></tr></thead><tbody>");
        foreach (var vehicle in changed)
        {
            h.Append("<tr><td>").Append(E(vehicle)).Append("</td><td>");
            Column(h, given.GetValueOrDefault(vehicle), why, vehicle, old: true, job.Units);
            h.Append("</td><td>");
            Column(h, planned.GetValueOrDefault(vehicle), why, vehicle, old: false, job.Units);
            h.Append("</td></tr>");
        }

        h.Append("</tbody></table>");
    }

    private static List<(string, double?)> Route(Dictionary<string, List<(string, double?)>> routes, string vehicle)
    {
        if (!routes.TryGetValue(vehicle, out var list))
        {
            routes[vehicle] = list = [];
        }

        return list;
    }

    private static void Column(StringBuilder h, List<(string Stop, double? Start)>? visits, Dictionary<string, StopChange> why, string vehicle, bool old, Core.Model.Units units)
    {
        if (visits is null || visits.Count == 0)
        {
            h.Append("<span class=\"meta\">no stops</span>");
            return;
        }

        foreach (var (stop, start) in visits)
        {
            h.Append("<div>").Append(start is double t ? E(units.Format(t)) + " " : string.Empty).Append(E(stop));
            if (why.TryGetValue(stop, out var c) && Mark(c, vehicle, old) is { } mark)
            {
                h.Append(" <span class=\"warn\">").Append(E(mark)).Append("</span>");
            }

            h.Append("</div>");
        }
    }

    /// <summary>What happened to the stop, as seen from this vehicle's given (old) or new column; null when nothing did here.</summary>
    private static string? Mark(StopChange c, string vehicle, bool old) => c.Reason switch
    {
        ChangeReason.Cancelled => old ? "cancelled" : null,
        ChangeReason.New => old ? null : "new",
        ChangeReason.Moved when old && c.OldVehicle == vehicle => c.NewVehicle is { } to ? $"moved to {to}" : "left unserved",
        ChangeReason.Moved when !old && c.NewVehicle == vehicle => $"from {c.OldVehicle}",
        ChangeReason.Retimed when !old && c.OldStart is double a && c.NewStart is double b => $"retimed by {Math.Round(b - a):+0;-0} min",
        _ => null,
    };
}
