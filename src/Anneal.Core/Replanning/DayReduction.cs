using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Core.Replanning;

/// <summary>
/// Reduces a job and a given plan to the residual instance of a re-plan. With `now`, a visit is fixed when its row
/// says `done` or `in-progress`, or when its start is at or before `now`; every visit before a
/// fixed one is fixed too (the driver has passed it). A vehicle that has left its last fixed place by `now` is on
/// the road to the next visit, which is then fixed as well (or, after its last visit, on its way home). A vehicle
/// taken out keeps only the visits it served; the rest of its route goes back into the pool. Without `now` nothing
/// is fixed: the given plan is only where the search starts.
/// </summary>
public static class DayReduction
{
    /// <exception cref="ReplanException">when the plan has a stop served by `now` that the job no longer has.</exception>
    public static ResidualDay Reduce(Instance day, ReplanRequest request)
    {
        var problems = new List<ReplanProblem>();
        var notes = new List<string>();
        int vehicles = day.Vehicles.Count;
        var routeOf = new GivenRoute?[vehicles];
        var inPlan = new bool[day.StopCount];
        var cancelled = new List<GivenVisit>();
        foreach (var route in request.Plan.Routes)
        {
            routeOf[route.Vehicle] = route;
            foreach (var visit in route.Visits)
            {
                if (visit.Stop >= 0)
                {
                    inPlan[visit.Stop] = true;
                }
            }
        }

        var fixedParts = new FixedPart[vehicles];
        var fixedStop = new bool[day.StopCount];
        for (int v = 0; v < vehicles; v++)
        {
            fixedParts[v] = Fix(day, v, routeOf[v], request, problems);
            foreach (var visit in fixedParts[v].Visits)
            {
                fixedStop[visit.Stop] = true;
            }
        }

        foreach (var route in request.Plan.Routes)
        {
            foreach (var visit in route.Visits)
            {
                if (visit.Stop < 0)
                {
                    cancelled.Add(visit);
                }
            }
        }

        if (problems.Count > 0)
        {
            throw new ReplanException(problems);
        }

        var newStops = new List<int>();
        var dayStop = new List<int>();
        for (int s = 0; s < day.StopCount; s++)
        {
            if (!inPlan[s])
            {
                newStops.Add(s);
            }

            if (!fixedStop[s])
            {
                dayStop.Add(s);
            }
        }

        var dayVehicle = new List<int>();
        for (int v = 0; v < vehicles; v++)
        {
            if (!fixedParts[v].TakenOut)
            {
                dayVehicle.Add(v);
            }
        }

        var residual = Build(day, request, [.. dayStop], [.. dayVehicle], fixedParts, routeOf, notes);
        var start = StartPlan([.. dayStop], [.. dayVehicle], routeOf);
        return new ResidualDay(day, residual, start, [.. dayStop], [.. dayVehicle], fixedParts, cancelled, newStops, notes, request);
    }

    /// <summary>`done` and `in-progress` say so; `planned` (what every row of a fresh routes.csv says) and an empty status leave it to the start time.</summary>
    private static bool Started(GivenVisit visit, double now) =>
        visit.Status is VisitStatus.Done or VisitStatus.InProgress || (visit.Start is double start && start <= now);

    /// <summary>When the vehicle left (or leaves) the visit: the file's departure, else its start plus service; null when the file gives neither.</summary>
    private static double? DepartureOf(Instance day, GivenVisit visit) =>
        visit.Departure ?? (visit.Start is double start && visit.Stop >= 0 ? start + day.ServiceTime(visit.Stop) : null);

    private static FixedPart Fix(Instance day, int v, GivenRoute? route, ReplanRequest request, List<ReplanProblem> problems)
    {
        var vehicle = day.Vehicles[v];
        bool takenOut = request.Without.Contains(v) || (request.Now is double t0 && vehicle.ShiftEnd <= t0);
        var visits = route?.Visits ?? [];
        int home = day.DepotLocation(vehicle.StartDepot);
        if (request.Now is not double now)
        {
            return new FixedPart(v, [], home, vehicle.ShiftStart, takenOut);
        }

        int count = 0;
        for (int k = 0; k < visits.Count; k++)
        {
            if (Started(visits[k], now))
            {
                count = k + 1;
            }
        }

        bool returning = false;
        if (!takenOut)
        {
            double? left = count > 0 ? DepartureOf(day, visits[count - 1]) : route?.DepotDeparture;
            if (left is double l && l < now)
            {
                int next = count;
                while (next < visits.Count && visits[next].Stop < 0)
                {
                    next++;
                }

                if (next < visits.Count)
                {
                    count = next + 1;
                }
                else if (count > 0)
                {
                    returning = true;
                }
            }
        }

        var kept = new List<GivenVisit>(count);
        for (int k = 0; k < count; k++)
        {
            if (visits[k].Stop < 0)
            {
                if (Started(visits[k], now) || k < count - 1)
                {
                    problems.Add(new ReplanProblem(visits[k].Row, "stop", visits[k].StopId,
                        $"stop {visits[k].StopId} is not in the job's stops, but the plan has it served by {day.Units.Format(now)}",
                        "put the stop back into the job (a stop already served cannot be cancelled), or correct its start or status"));
                }

                continue;
            }

            kept.Add(visits[k]);
        }

        if (kept.Count == 0)
        {
            return new FixedPart(v, kept, home, Math.Max(vehicle.ShiftStart, now), takenOut);
        }

        var last = kept[^1];
        double leave = Math.Max(now, DepartureOf(day, last) ?? now);
        if (returning)
        {
            int end = day.DepotLocation(vehicle.EndDepot);
            return new FixedPart(v, kept, end, Math.Max(now, route?.Return ?? (leave + day.Travel.Duration(last.Stop, end))), takenOut);
        }

        return new FixedPart(v, kept, last.Stop, leave, takenOut);
    }

    private static Instance Build(Instance day, ReplanRequest request, int[] dayStop, int[] dayVehicle, FixedPart[] fixedParts, GivenRoute?[] routeOf, List<string> notes)
    {
        int dims = day.DimensionCount;
        var equipment = new List<string>(day.EquipmentNames);
        var pinBit = new ulong[day.Vehicles.Count];
        var oldVehicle = new int[day.StopCount];
        var oldStart = new double[day.StopCount];
        var pinned = new bool[day.StopCount];
        Array.Fill(oldVehicle, -1);
        Array.Fill(oldStart, double.NaN);
        foreach (var route in request.Plan.Routes)
        {
            foreach (var visit in route.Visits)
            {
                if (visit.Stop < 0)
                {
                    continue;
                }

                oldVehicle[visit.Stop] = route.Vehicle;
                oldStart[visit.Stop] = visit.Start ?? double.NaN;
                pinned[visit.Stop] = visit.Pinned;
            }
        }

        // A pin is an item of equipment only the stop's vehicle carries, so every solver keeps it as a hard rule.
        var residualIndex = new int[day.Vehicles.Count];
        Array.Fill(residualIndex, -1);
        for (int r = 0; r < dayVehicle.Length; r++)
        {
            residualIndex[dayVehicle[r]] = r;
        }

        var residualStop = new int[day.StopCount];
        Array.Fill(residualStop, -1);
        for (int i = 0; i < dayStop.Length; i++)
        {
            residualStop[dayStop[i]] = i;
        }

        var stops = new Stop[dayStop.Length];
        for (int i = 0; i < stops.Length; i++)
        {
            int s = dayStop[i];
            int old = oldVehicle[s];
            ulong needs = day.Stops[s].Needs;
            if (pinned[s] && old >= 0)
            {
                if (residualIndex[old] < 0)
                {
                    notes.Add($"stop {day.Stops[s].Id} is pinned to vehicle {day.Vehicles[old].Id}, which is taken out: the pin is dropped");
                }
                else
                {
                    if (pinBit[old] == 0)
                    {
                        if (equipment.Count >= 64)
                        {
                            throw new ReplanException([new ReplanProblem(0, "pinned", null, "stops are pinned to more vehicles than the job's equipment items leave room for (64 in all)",
                                "pin stops to fewer vehicles")]);
                        }

                        pinBit[old] = 1UL << equipment.Count;
                        equipment.Add("pinned to " + day.Vehicles[old].Id);
                    }

                    needs |= pinBit[old];
                }
            }

            stops[i] = day.Stops[s] with
            {
                Needs = needs,
                PlannedVehicle = old >= 0 ? residualIndex[old] : -1,
                PlannedStart = oldStart[s],

                // A delivery whose goods were collected before now is a plain delivery from where they are now.
                CollectFrom = day.Stops[s].CollectFrom >= 0 ? residualStop[day.Stops[s].CollectFrom] : -1,
            };
        }

        var depots = new List<Depot>(day.Depots);
        var locations = new List<int>(dayStop.Length + depots.Count + dayVehicle.Length);
        locations.AddRange(dayStop);
        for (int d = 0; d < day.Depots.Count; d++)
        {
            locations.Add(day.DepotLocation(d));
        }

        var vehicles = new Vehicle[dayVehicle.Length];
        for (int r = 0; r < dayVehicle.Length; r++)
        {
            int v = dayVehicle[r];
            var part = fixedParts[v];
            var vehicle = day.Vehicles[v];
            int startDepot = vehicle.StartDepot;
            if (part.ContinueLocation < day.StopCount)
            {
                var at = day.Stops[part.ContinueLocation];
                startDepot = depots.Count;
                depots.Add(new Depot { Id = at.Id, Name = at.Name, Address = at.Address, X = at.X, Y = at.Y });
                locations.Add(part.ContinueLocation);
            }
            else if (part.ContinueLocation != day.DepotLocation(vehicle.StartDepot))
            {
                startDepot = part.ContinueLocation - day.StopCount;
            }

            bool started = part.Visits.Count > 0;
            var capacity = (double[])vehicle.Capacity.Clone();
            // The rest of the route starts loaded with what it delivers (as any route does), beside what the fixed
            // visits collected: goods for a stop moved onto this vehicle are taken to be brought to it.
            foreach (var visit in part.Visits)
            {
                var pickup = day.Stops[visit.Stop].Pickup;
                for (int d = 0; d < dims && d < pickup.Length; d++)
                {
                    capacity[d] = Math.Max(0, capacity[d] - pickup[d]);
                }
            }

            double routeStart = routeOf[v]?.DepotDeparture ?? vehicle.ShiftStart;
            vehicles[r] = vehicle with
            {
                StartDepot = startDepot,
                Capacity = capacity,
                ShiftStart = part.ContinueAt,
                MaxDuration = started ? Math.Max(0, vehicle.MaxDuration - (part.ContinueAt - routeStart)) : vehicle.MaxDuration,
                FixedCost = started ? 0 : vehicle.FixedCost,
                Equipment = vehicle.Equipment | pinBit[v],
            };
        }

        return new Instance(day.Name, stops, depots, vehicles, day.DimensionNames, equipment, day.Rules, day.Objective,
            day.Travel.Subset([.. locations]), day.Units) { LatLon = day.LatLon };
    }

    private static Plan StartPlan(int[] dayStop, int[] dayVehicle, GivenRoute?[] routeOf)
    {
        var index = new Dictionary<int, int>(dayStop.Length);
        for (int i = 0; i < dayStop.Length; i++)
        {
            index[dayStop[i]] = i;
        }

        var routes = new List<PlannedRoute>();
        for (int r = 0; r < dayVehicle.Length; r++)
        {
            var stops = new List<int>();
            foreach (var visit in routeOf[dayVehicle[r]]?.Visits ?? [])
            {
                if (visit.Stop >= 0 && index.TryGetValue(visit.Stop, out int i))
                {
                    stops.Add(i);
                }
            }

            if (stops.Count > 0)
            {
                routes.Add(new PlannedRoute(r, [.. stops]));
            }
        }

        return new Plan(routes);
    }
}
