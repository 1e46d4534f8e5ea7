using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Replanning;

namespace Anneal.Formats.Output;

/// <summary>
/// routes.csv of a re-plan: per vehicle of the job, the visits fixed by `--now` as the given plan has them (status
/// `done`, or `in-progress` while service or the drive to it goes on at `--now`), then the rest of its route as
/// planned from where it continues; a vehicle taken out ends after its last served stop.
/// </summary>
internal static class DayRoutes
{
    public static void Write(CsvHelper.CsvWriter csv, Instance residual, PlanEvaluation evaluation, ResidualDay day)
    {
        var job = day.Day;
        var routeOf = new RouteEvaluation?[residual.Vehicles.Count];
        foreach (var route in evaluation.Routes)
        {
            routeOf[route.Vehicle] = route;
        }

        double now = day.Request.Now ?? double.NegativeInfinity;
        foreach (var part in day.Fixed)
        {
            int r = day.ResidualVehicle(part.Vehicle);
            var route = r >= 0 ? routeOf[r] : null;
            if (part.Visits.Count == 0)
            {
                if (route is { Stops.Length: > 0 })
                {
                    Rest(csv, residual, day, route, 0, writeStart: true);
                }

                continue;
            }

            var v = job.Vehicles[part.Vehicle];
            var given = day.Request.Plan.Routes.FirstOrDefault(g => g.Vehicle == part.Vehicle);
            var load = new double[job.DimensionCount];
            foreach (var visit in part.Visits)
            {
                Add(load, job, visit.Stop, 1);
            }

            if (route is not null)
            {
                foreach (int s in route.Stops)
                {
                    Add(load, residual, s, 1);
                }
            }

            var depot = job.Depots[v.StartDepot];
            RoutesCsvWriter.Row(csv, v.Id, 0, "start", depot.Id, depot.Name, depot.Address, string.Empty, string.Empty,
                given?.DepotDeparture is double leave ? job.Units.Format(leave) : string.Empty, string.Empty, string.Empty, string.Empty, 0, 0, (double[])load.Clone(), "done");
            RoutesCsvWriter.Handled(csv, job, -1);
            int from = job.DepotLocation(v.StartDepot);
            int sequence = 1;
            foreach (var visit in part.Visits)
            {
                var stop = job.Stops[visit.Stop];
                Add(load, job, visit.Stop, -1);
                bool going = visit.Departure is double d ? d > now : visit.Start is not double st || st + job.ServiceTime(visit.Stop) > now;
                RoutesCsvWriter.Row(csv, v.Id, sequence++, "stop", stop.Id, stop.Name, stop.Address, string.Empty, Clock(job, visit.Start), Clock(job, visit.Departure),
                    string.Empty, string.Empty, string.Empty, job.Travel.Distance(from, visit.Stop), job.Travel.Duration(from, visit.Stop), (double[])load.Clone(),
                    going ? "in-progress" : "done");
                RoutesCsvWriter.Handled(csv, job, visit.Stop);
                from = visit.Stop;
            }

            bool home = part.ContinueLocation >= job.StopCount;
            if (home || route is not { Stops.Length: > 0 })
            {
                int end = home ? part.ContinueLocation : job.DepotLocation(v.EndDepot);
                var endDepot = job.Depots[end - job.StopCount];
                double back = home ? part.ContinueAt : part.ContinueAt + job.Travel.Duration(from, end);
                RoutesCsvWriter.Row(csv, v.Id, sequence++, "end", endDepot.Id, endDepot.Name, endDepot.Address, job.Units.Format(back), string.Empty, string.Empty,
                    string.Empty, string.Empty, string.Empty, job.Travel.Distance(from, end), job.Travel.Duration(from, end), new double[job.DimensionCount],
                    home && back <= now ? "done" : home ? "in-progress" : RoutesCsvWriter.Planned);
                RoutesCsvWriter.Handled(csv, job, -1);
            }

            if (route is { Stops.Length: > 0 })
            {
                Rest(csv, residual, day, route, sequence, writeStart: home);
            }
        }
    }

    /// <summary>A residual route from its start (a depot, or the stop the vehicle continues from, whose row is already written).</summary>
    private static void Rest(CsvHelper.CsvWriter csv, Instance instance, ResidualDay day, RouteEvaluation route, int sequence, bool writeStart)
    {
        var v = instance.Vehicles[route.Vehicle];
        var travel = instance.Travel;
        int from = instance.DepotLocation(v.StartDepot);
        double[] onBoard = RoutesCsvWriter.Loaded(instance, route);
        if (writeStart)
        {
            var start = instance.Depots[v.StartDepot];
            RoutesCsvWriter.Row(csv, v.Id, sequence++, "start", start.Id, start.Name, start.Address, string.Empty, string.Empty, instance.Units.Format(route.Metrics.Departure),
                string.Empty, string.Empty, string.Empty, 0, 0, onBoard);
            RoutesCsvWriter.Handled(csv, day.Day, -1);
        }

        for (int k = 0; k < route.Stops.Length; k++)
        {
            int s = route.Stops[k];
            var stop = instance.Stops[s];
            var visit = route.Visits[k];
            RoutesCsvWriter.Row(csv, v.Id, sequence++, "stop", stop.Id, stop.Name, stop.Address, instance.Units.Format(visit.Arrival), instance.Units.Format(visit.Start),
                instance.Units.Format(visit.Departure), TimeText.Number(visit.Wait), TimeText.Number(visit.Late),
                TimeText.Window(instance, RoutesCsvWriter.WindowUsed(stop, visit.Arrival)), travel.Distance(from, s), travel.Duration(from, s), route.LoadAfter[k]);
            RoutesCsvWriter.Handled(csv, day.Day, day.DayStop[s]);
            from = s;
        }

        int home = instance.DepotLocation(v.EndDepot);
        var end = instance.Depots[v.EndDepot];
        RoutesCsvWriter.Row(csv, v.Id, sequence, "end", end.Id, end.Name, end.Address, instance.Units.Format(route.Metrics.Return), string.Empty, string.Empty,
            string.Empty, string.Empty, string.Empty, travel.Distance(from, home), travel.Duration(from, home), route.LoadAfter[^1]);
        RoutesCsvWriter.Handled(csv, day.Day, -1);
    }

    private static string Clock(Instance job, double? time) => time is double t ? job.Units.Format(t) : string.Empty;

    private static void Add(double[] load, Instance instance, int stop, int sign)
    {
        for (int d = 0; d < load.Length; d++)
        {
            load[d] += sign * instance.Demand(stop, d);
        }
    }
}
