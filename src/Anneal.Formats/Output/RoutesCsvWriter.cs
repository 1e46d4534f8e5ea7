using System.Globalization;
using Anneal.Core.DrivingRules;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Replanning;

namespace Anneal.Formats.Output;

/// <summary>
/// routes.csv, the drivers' sheet as data: per route the depot departure (kind <c>start</c>), one row per visit in
/// order (<c>stop</c>) and the return (<c>end</c>), each with the leg driven from the row before, the evaluator's
/// schedule and the load left on board. Under driving rules each break is a row of its own (<c>break</c>, its start and
/// departure, no stop) placed where it is taken; <c>drive</c> is always the driving since the row before, so a break
/// that splits a leg carries the driving before it and the next row the rest (the leg's distance stays on that row).
/// </summary>
public static class RoutesCsvWriter
{
    public const string FileName = "routes.csv";

    /// <summary>The columns before the per-dimension loads, in order (the README documents each).</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["vehicle", "sequence", "kind", "stop", "name", "address", "arrival", "start", "departure", "wait", "late", "window", "distance", "drive", "status"];

    public static void Write(string path, Instance instance, PlanEvaluation evaluation, ResidualDay? replan = null) =>
        AtomicFile.WriteText(path, writer => Write(writer, instance, evaluation, replan));

    /// <param name="replan">In a re-plan (<paramref name="instance"/> is then its residual instance): each vehicle's fixed
    /// visits come first, as the given plan has them, then the rest of its route from where it continues.</param>
    public static void Write(TextWriter writer, Instance instance, PlanEvaluation evaluation, ResidualDay? replan = null)
    {
        using var csv = CsvOutput.Open(writer);
        Header(csv, replan?.Day ?? instance);
        if (replan is not null)
        {
            DayRoutes.Write(csv, instance, evaluation, replan);
            csv.Flush();
            return;
        }

        foreach (var route in evaluation.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            var v = instance.Vehicles[route.Vehicle];
            var travel = instance.Travel;
            var start = instance.Depots[v.StartDepot];
            var end = instance.Depots[v.EndDepot];
            int from = instance.DepotLocation(v.StartDepot);
            double[] onBoard = Loaded(instance, route);

            Row(csv, v.Id, 0, "start", start.Id, start.Name, start.Address, string.Empty, string.Empty, instance.Units.Format(route.Metrics.Departure),
                string.Empty, string.Empty, string.Empty, 0, 0, onBoard);
            Handled(csv, instance, -1);
            int sequence = 1, next = 0;
            double[] carried = onBoard;
            for (int k = 0; k < route.Stops.Length; k++)
            {
                int s = route.Stops[k];
                var stop = instance.Stops[s];
                var visit = route.Visits[k];
                next = Breaks(csv, instance, route, v.Id, k, next, after: false, ref sequence, carried);
                Row(csv, v.Id, sequence++, "stop", stop.Id, stop.Name, stop.Address, instance.Units.Format(visit.Arrival), instance.Units.Format(visit.Start),
                    instance.Units.Format(visit.Departure), TimeText.Number(visit.Wait), TimeText.Number(visit.Late),
                    TimeText.Window(instance, WindowUsed(stop, visit.Arrival)), travel.Distance(from, s), visit.Drive, route.LoadAfter[k]);
                Handled(csv, instance, s);
                carried = route.LoadAfter[k];
                next = Breaks(csv, instance, route, v.Id, k, next, after: true, ref sequence, carried);
                from = s;
            }

            int home = instance.DepotLocation(v.EndDepot);
            double lastLeg = travel.Duration(from, home);
            for (int b = next; b < route.Breaks.Count; b++)
            {
                lastLeg -= route.Breaks[b].Drive;
            }

            Breaks(csv, instance, route, v.Id, route.Stops.Length, next, after: false, ref sequence, carried);
            Row(csv, v.Id, sequence, "end", end.Id, end.Name, end.Address, instance.Units.Format(route.Metrics.Return), string.Empty, string.Empty,
                string.Empty, string.Empty, string.Empty, travel.Distance(from, home), Math.Max(0, lastLeg), route.LoadAfter[^1]);
            Handled(csv, instance, -1);
        }

        csv.Flush();
    }

    /// <summary>The rows of the breaks taken at position <paramref name="k"/> before (or after) its service, from break <paramref name="next"/> on.</summary>
    private static int Breaks(CsvHelper.CsvWriter csv, Instance instance, RouteEvaluation route, string vehicle, int k, int next, bool after, ref int sequence, double[] load)
    {
        var breaks = route.Breaks;
        while (next < breaks.Count && breaks[next].Position == k && (breaks[next].Place == BreakPlace.AfterService) == after)
        {
            var b = breaks[next++];
            Row(csv, vehicle, sequence++, "break", string.Empty, BreakName(b), string.Empty, string.Empty, instance.Units.Format(b.Start),
                instance.Units.Format(b.End), string.Empty, string.Empty, string.Empty, 0, b.Drive, load);
            Handled(csv, instance, -1);
        }

        return next;
    }

    /// <summary>What the driver sheet says of a break: its kind and where it is taken.</summary>
    public static string BreakName(in PlannedBreak b)
    {
        string what = b.FirstPart ? "break, first part" : "break";
        return b.Place switch
        {
            BreakPlace.Road => what + ", on the road",
            BreakPlace.Waiting => what + ", while waiting for the window",
            BreakPlace.AfterService => what + ", after service",
            _ => what + ", on arrival",
        };
    }

    private static void Header(CsvHelper.CsvWriter csv, Instance instance)
    {
        foreach (var name in Columns)
        {
            csv.WriteField(name);
        }

        foreach (var dim in instance.DimensionNames)
        {
            csv.WriteField("load_" + dim);
        }

        // Only jobs with pickups get what each stop hands over and takes on, and the pair; delivery-only files keep their shape.
        if (instance.HasPickups)
        {
            foreach (var dim in instance.DimensionNames)
            {
                csv.WriteField("delivered_" + dim);
            }

            foreach (var dim in instance.DimensionNames)
            {
                csv.WriteField("collected_" + dim);
            }

            csv.WriteField("pair");
        }

        csv.NextRecord();
    }

    /// <summary>The `status` of a row still to be driven; a re-plan writes `done` and `in-progress` on its fixed rows.</summary>
    public const string Planned = "planned";

    /// <summary>A row up to its loads; <see cref="Handled"/> ends it.</summary>
    internal static void Row(CsvHelper.CsvWriter csv, string vehicle, int sequence, string kind, string id, string name, string address, string arrival, string start,
        string departure, string wait, string late, string window, double distance, double drive, double[] load, string status = Planned)
    {
        foreach (var field in new[] { vehicle, sequence.ToString(CultureInfo.InvariantCulture), kind, id, name, address, arrival, start, departure, wait, late, window,
            TimeText.Number(distance), TimeText.Number(drive), status })
        {
            csv.WriteField(field);
        }

        foreach (double x in load)
        {
            csv.WriteField(TimeText.Amount(x));
        }

    }

    /// <summary>With pickups: what the stop receives and hands over per dimension, and its pair; empty on depot rows (stop -1).</summary>
    internal static void Handled(CsvHelper.CsvWriter csv, Instance instance, int stop)
    {
        if (instance.HasPickups)
        {
            for (int d = 0; d < instance.DimensionCount; d++)
            {
                csv.WriteField(stop < 0 ? string.Empty : TimeText.Amount(instance.Demand(stop, d)));
            }

            for (int d = 0; d < instance.DimensionCount; d++)
            {
                csv.WriteField(stop < 0 ? string.Empty : TimeText.Amount(instance.Pickup(stop, d)));
            }

            csv.WriteField(stop < 0 ? string.Empty : PairName(instance, stop));
        }

        csv.NextRecord();
    }

    /// <summary>"collection>delivery" for either stop of a pair (the same text on both rows), empty for a stop in none.</summary>
    public static string PairName(Instance instance, int stop)
    {
        int partner = instance.Partner(stop);
        if (partner < 0)
        {
            return string.Empty;
        }

        bool collection = instance.IsCollection(stop);
        return instance.Stops[collection ? stop : partner].Id + ">" + instance.Stops[collection ? partner : stop].Id;
    }

    /// <summary>The load on board when the vehicle leaves its depot: every delivery of its route that comes from the depot.</summary>
    public static double[] Loaded(Instance instance, RouteEvaluation route)
    {
        var load = new double[instance.DimensionCount];
        for (int d = 0; d < load.Length; d++)
        {
            load[d] = RouteLoads.Departure(instance, route.Stops, d);
        }

        return load;
    }

    /// <summary>The window the scheduler served in: the first still open on arrival, else the last (served late).</summary>
    public static TimeWindow WindowUsed(Stop stop, double arrival)
    {
        foreach (var w in stop.Windows)
        {
            if (w.Close >= arrival)
            {
                return w;
            }
        }

        return stop.Windows.Length > 0 ? stop.Windows[^1] : TimeWindow.Always;
    }
}
