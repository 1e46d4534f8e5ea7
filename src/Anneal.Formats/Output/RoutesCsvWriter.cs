using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Replanning;

namespace Anneal.Formats.Output;

/// <summary>
/// routes.csv, the drivers' sheet as data: per route the depot departure (kind <c>start</c>), one row per visit in
/// order (<c>stop</c>) and the return (<c>end</c>), each with the leg driven from the row before, the evaluator's
/// schedule and the load left on board. (Later kinds, such as a driver's break, only add rows.)
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
            for (int k = 0; k < route.Stops.Length; k++)
            {
                int s = route.Stops[k];
                var stop = instance.Stops[s];
                var visit = route.Visits[k];
                Row(csv, v.Id, k + 1, "stop", stop.Id, stop.Name, stop.Address, instance.Units.Format(visit.Arrival), instance.Units.Format(visit.Start),
                    instance.Units.Format(visit.Departure), TimeText.Number(visit.Wait), TimeText.Number(visit.Late),
                    TimeText.Window(instance, WindowUsed(stop, visit.Arrival)), travel.Distance(from, s), travel.Duration(from, s), route.LoadAfter[k]);
                Handled(csv, instance, s);
                from = s;
            }

            int home = instance.DepotLocation(v.EndDepot);
            Row(csv, v.Id, route.Stops.Length + 1, "end", end.Id, end.Name, end.Address, instance.Units.Format(route.Metrics.Return), string.Empty, string.Empty,
                string.Empty, string.Empty, string.Empty, travel.Distance(from, home), travel.Duration(from, home), route.LoadAfter[^1]);
            Handled(csv, instance, -1);
        }

        csv.Flush();
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
