using System.Text;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Output;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>
/// One sheet per vehicle used, to hand to its driver: the stops in order with arrival, window, load on board and minutes
/// late; on a job with pickups also what is delivered and what is collected at each stop, with the pair's other stop.
/// </summary>
internal static class RouteSheets
{
    public static void Write(StringBuilder h, ReportInput input)
    {
        var instance = input.Instance;
        int used = 0;
        foreach (var route in input.Plan.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            Sheet(h, input, instance, route, RouteColours.Of(used));
            used++;
        }

        if (used == 0)
        {
            h.Append("<p class=\"none\">No vehicle leaves the depot in this plan.</p>");
        }
    }

    private static void Sheet(StringBuilder h, ReportInput input, Instance instance, RouteEvaluation route, string colour)
    {
        var v = instance.Vehicles[route.Vehicle];
        var m = route.Metrics;
        string unit = instance.Units.TimeWords;
        h.Append("<section class=\"sheet\" data-vehicle=\"").Append(E(v.Id)).Append("\"><h3><span class=\"swatch\" style=\"background:").Append(colour)
            .Append("\" title=\"its colour on the map\"></span>Vehicle ").Append(E(v.Id)).Append("</h3>")
            .Append("<p class=\"sum\">").Append(route.Stops.Length).Append(" stops · leaves ").Append(E(instance.Depots[v.StartDepot].Id))
            .Append(" at ").Append(instance.Units.Format(m.Departure)).Append(" · back at ").Append(E(instance.Depots[v.EndDepot].Id))
            .Append(' ').Append(instance.Units.Format(m.Return)).Append(" · ").Append(Num(m.Distance, "0.0")).Append(E(instance.Units.DistanceSuffix))
            .Append(" · loaded ").Append(E(Load(instance, StartLoad(instance, route))))
            .Append(" · route objective ").Append(Money(route.Objective));
        if (m.Overtime > CostModel.FeasibilityTolerance)
        {
            h.Append(" · <span class=\"bad\">").Append(Num(m.Overtime, "0")).Append(' ').Append(unit).Append(" over the shift end</span>");
        }

        DrivingLine(h, instance, route, v, unit);

        var start = instance.Depots[v.StartDepot];
        var end = instance.Depots[v.EndDepot];
        bool pickups = instance.HasPickups;
        string blanks = pickups ? "<td></td><td></td>" : string.Empty;
        h.Append("</p><table><thead><tr><th class=\"n\">#</th><th>stop</th><th>name and address</th><th class=\"n\">arrival</th><th>window</th>")
            .Append("<th class=\"n\">start of service</th><th class=\"n\">leaves</th>").Append(pickups ? "<th>delivers</th><th>collects</th>" : string.Empty)
            .Append("<th>load on board after</th><th class=\"n\">").Append(unit).Append(" late</th></tr></thead><tbody>");
        h.Append("<tr class=\"depot\"><td class=\"n\">0</td><td>").Append(E(start.Id)).Append("</td><td>").Append(Place(start.Name, start.Address))
            .Append("</td><td class=\"n\"></td><td></td><td class=\"n\"></td><td class=\"n\">").Append(instance.Units.Format(m.Departure))
            .Append("</td>").Append(blanks).Append("<td>").Append(E(Load(instance, StartLoad(instance, route)))).Append("</td><td class=\"n\"></td></tr>");
        int next = 0;
        for (int k = 0; k < route.Stops.Length; k++)
        {
            var stop = instance.Stops[route.Stops[k]];
            var visit = route.Visits[k];
            next = BreakRows(h, instance, route, k, next, after: false);
            bool late = visit.Late > CostModel.FeasibilityTolerance;
            h.Append(late ? "<tr class=\"late\">" : "<tr>")
                .Append("<td class=\"n\">").Append(k + 1).Append("</td>")
                .Append("<td>").Append(E(stop.Id)).Append("</td>")
                .Append("<td>").Append(Place(stop.Name, stop.Address)).Append("</td>")
                .Append("<td class=\"n\">").Append(instance.Units.Format(visit.Arrival)).Append("</td>")
                .Append("<td>").Append(E(Windows(instance, stop))).Append("</td>")
                .Append("<td class=\"n\">").Append(instance.Units.Format(visit.Start)).Append("</td>")
                .Append("<td class=\"n\">").Append(instance.Units.Format(visit.Departure)).Append("</td>")
                .Append(pickups ? Handed(instance, route.Stops[k]) : string.Empty)
                .Append("<td>").Append(E(Load(instance, route.LoadAfter[k]))).Append("</td>")
                .Append("<td class=\"n\">").Append(late ? Num(visit.Late, "0.#") : string.Empty).Append("</td></tr>");
            next = BreakRows(h, instance, route, k, next, after: true);
        }

        BreakRows(h, instance, route, route.Stops.Length, next, after: false);

        h.Append("<tr class=\"depot\"><td class=\"n\">").Append(route.Stops.Length + 1).Append("</td><td>").Append(E(end.Id)).Append("</td><td>")
            .Append(Place(end.Name, end.Address)).Append("</td><td class=\"n\">").Append(instance.Units.Format(m.Return))
            .Append("</td><td></td><td class=\"n\"></td><td class=\"n\"></td>").Append(blanks).Append("<td>back at the depot</td><td class=\"n\"></td></tr>");
        h.Append("</tbody></table></section>");
    }

    /// <summary>Under driving rules: the rule set with its source, the day's driving, breaks and duty span; a breach in red.</summary>
    private static void DrivingLine(StringBuilder h, Instance instance, RouteEvaluation route, Vehicle v, string unit)
    {
        if (v.DrivingRules is not { } rules)
        {
            return;
        }

        var m = route.Metrics;
        h.Append("<br>Driving rules ").Append(E(rules.Title)).Append(": ").Append(Num(m.Driving, "0")).Append(' ').Append(unit).Append(" driving · ")
            .Append(route.Breaks.Count).Append(route.Breaks.Count == 1 ? " break, " : " breaks, ").Append(Num(m.BreakMinutes, "0")).Append(' ').Append(unit)
            .Append(" · duty span ").Append(Num(m.Return - m.Departure, "0")).Append(' ').Append(unit);
        var (drive, span) = Core.DrivingRules.BreakScheduler.Excess(instance, rules, m);
        if (drive > CostModel.FeasibilityTolerance || span > CostModel.FeasibilityTolerance)
        {
            h.Append(" · <span class=\"bad\">").Append(rules.Rule.Hard ? "breaks the rules: " : "over the soft limits: ");
            if (drive > CostModel.FeasibilityTolerance)
            {
                h.Append(Num(drive, "0")).Append(' ').Append(unit).Append(" more driving than allowed ");
            }

            if (span > CostModel.FeasibilityTolerance)
            {
                h.Append(Num(span, "0")).Append(' ').Append(unit).Append(" longer duty span than allowed ");
            }

            h.Append('(').Append(E(Cautions.DrivingRules)).Append(")</span>");
        }
    }

    /// <summary>The rows of the breaks taken at stop <paramref name="k"/> before (or after) its service, from break <paramref name="next"/> on.</summary>
    private static int BreakRows(StringBuilder h, Instance instance, RouteEvaluation route, int k, int next, bool after)
    {
        var breaks = route.Breaks;
        while (next < breaks.Count && breaks[next].Position == k && (breaks[next].Place == Core.DrivingRules.BreakPlace.AfterService) == after)
        {
            var b = breaks[next++];
            h.Append("<tr class=\"break\"><td class=\"n\"></td><td>break</td><td>").Append(E(RoutesCsvWriter.BreakName(b))).Append(" · ")
                .Append(Num(b.Minutes, "0")).Append(' ').Append(instance.Units.TimeWords).Append("</td><td class=\"n\"></td><td></td><td class=\"n\">")
                .Append(instance.Units.Format(b.Start)).Append("</td><td class=\"n\">").Append(instance.Units.Format(b.End))
                .Append("</td>").Append(instance.HasPickups ? "<td></td><td></td>" : string.Empty).Append("<td></td><td class=\"n\"></td></tr>");
        }

        return next;
    }

    /// <summary>The delivers and collects cells of a stop: amounts per dimension, and for a pair the stop at its other end.</summary>
    private static string Handed(Instance instance, int stop)
    {
        int dims = instance.DimensionCount;
        var delivered = new double[dims];
        var collected = new double[dims];
        for (int d = 0; d < dims; d++)
        {
            delivered[d] = instance.Demand(stop, d);
            collected[d] = instance.Pickup(stop, d);
        }

        int partner = instance.Partner(stop);
        string other = partner < 0 ? string.Empty : instance.Stops[partner].Id;
        string delivers = Handing(instance, delivered, partner >= 0 && !instance.IsCollection(stop) ? " collected at " + other : string.Empty);
        string collects = Handing(instance, collected, partner >= 0 && instance.IsCollection(stop) ? " for " + other : string.Empty);
        return "<td>" + E(delivers) + "</td><td>" + E(collects) + "</td>";
    }

    /// <summary>The amounts that are not zero, with a note; empty when there are none.</summary>
    private static string Handing(Instance instance, double[] amounts, string note)
    {
        foreach (double a in amounts)
        {
            if (a != 0)
            {
                return Load(instance, amounts) + note;
            }
        }

        return string.Empty;
    }

    /// <summary>The name in bold over the address, both encoded; empty when the input gives neither.</summary>
    private static string Place(string name, string address) =>
        (name.Length > 0 ? "<b>" + E(name) + "</b>" : string.Empty) + (name.Length > 0 && address.Length > 0 ? "<br>" : string.Empty) + E(address);

    private static string Windows(Instance instance, Stop stop)
    {
        var parts = new List<string>(stop.Windows.Length);
        foreach (var w in stop.Windows)
        {
            parts.Add(TimeText.Window(instance, w));
        }

        return string.Join(", ", parts);
    }

    private static double[] StartLoad(Instance instance, RouteEvaluation route) => RoutesCsvWriter.Loaded(instance, route);

    private static string Load(Instance instance, double[] load)
    {
        var parts = new List<string>(load.Length);
        for (int d = 0; d < load.Length; d++)
        {
            string name = d < instance.DimensionNames.Count ? instance.DimensionNames[d] : string.Empty;
            parts.Add((TimeText.Amount(load[d]) + " " + name).Trim());
        }

        return string.Join(" · ", parts);
    }
}
