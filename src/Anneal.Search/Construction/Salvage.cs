using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Search.Construction;

/// <summary>
/// Turns a plan that breaks hard rules into one a dispatcher can drive: stops come off each route that breaks a hard
/// rule, one at a time (the one whose removal helps the route most), until the route keeps every hard rule; then every
/// stop left over goes back at its cheapest position that keeps its route within the hard rules, if there is one.
/// What still fits nowhere stays unserved, and the plan says so. Plain arrays over the exact evaluator; the work is
/// capped so that a huge plan costs at most about a second.
/// </summary>
public static class Salvage
{
    /// <summary>Stops measured in all (each route measure counts its length); past it, removal takes the last stop and reinsertion stops.</summary>
    private const long WorkLimit = 40_000_000;

    public static Plan Drivable(Instance instance, Plan plan)
    {
        var routes = new List<int>[instance.Vehicles.Count];
        for (int v = 0; v < routes.Length; v++)
        {
            routes[v] = [];
        }

        var pool = new List<int>();
        var served = new bool[instance.StopCount];
        foreach (var route in plan.Routes)
        {
            routes[route.Vehicle].AddRange(route.Stops);
            foreach (int s in route.Stops)
            {
                served[s] = true;
            }
        }

        long work = 0;
        for (int v = 0; v < routes.Length; v++)
        {
            Unload(instance, v, routes[v], pool, ref work);
        }

        for (int s = 0; s < instance.StopCount; s++)
        {
            if (!served[s])
            {
                pool.Add(s);
            }
        }

        // Stops that must be served first; then two orders, kept by the ranking: the largest first packs the fleet
        // well when room is not what runs out, the smallest first serves more stops when it is.
        var largest = new List<int>(pool);
        largest.Sort((a, b) => instance.MayDrop(a).CompareTo(instance.MayDrop(b)) is int c && c != 0 ? c : TotalDemand(instance, b).CompareTo(TotalDemand(instance, a)));
        var smallest = new List<int>(pool);
        smallest.Sort((a, b) => instance.MayDrop(a).CompareTo(instance.MayDrop(b)) is int c && c != 0 ? c : TotalDemand(instance, a).CompareTo(TotalDemand(instance, b)));
        var first = Refill(instance, routes, largest, ref work);
        var second = Refill(instance, routes, smallest, ref work);
        return PlanRanking.IsBetter(PlanEvaluator.Evaluate(instance, second), PlanEvaluator.Evaluate(instance, first)) ? second : first;
    }

    /// <summary>The routes with the pool's stops put back in the given order (the routes given are not changed).</summary>
    private static Plan Refill(Instance instance, List<int>[] kept, List<int> order, ref long work)
    {
        var routes = new List<int>[kept.Length];
        for (int v = 0; v < routes.Length; v++)
        {
            routes[v] = [.. kept[v]];
        }

        foreach (int s in order)
        {
            if (work > WorkLimit)
            {
                break;
            }

            Reinsert(instance, routes, s, ref work);
        }

        var result = new List<PlannedRoute>();
        for (int v = 0; v < routes.Length; v++)
        {
            if (routes[v].Count > 0)
            {
                result.Add(new PlannedRoute(v, [.. routes[v]]));
            }
        }

        return new Plan(result);
    }

    /// <summary>Takes stops off one route until it keeps every hard rule.</summary>
    private static void Unload(Instance instance, int vehicle, List<int> route, List<int> pool, ref long work)
    {
        var unit = PenaltyWeights.Uniform(1);
        var trial = new int[route.Count];
        while (route.Count > 0)
        {
            var m = RouteScheduler.Measure(instance, vehicle, route.ToArray());
            work += route.Count;
            if (CostModel.RouteFeasible(instance, m))
            {
                return;
            }

            int drop = route.Count - 1;
            if (work + ((long)route.Count * route.Count) <= WorkLimit)
            {
                double best = double.PositiveInfinity;
                for (int k = 0; k < route.Count; k++)
                {
                    int n = 0;
                    for (int j = 0; j < route.Count; j++)
                    {
                        if (j != k)
                        {
                            trial[n++] = route[j];
                        }
                    }

                    var t = RouteScheduler.Measure(instance, vehicle, trial.AsSpan(0, n));
                    work += n;
                    double score = (CostModel.RouteViolation(instance, t, unit) * 1e6) + CostModel.RouteObjective(instance, vehicle, t);
                    if (score < best)
                    {
                        best = score;
                        drop = k;
                    }
                }
            }

            pool.Add(route[drop]);
            route.RemoveAt(drop);
        }
    }

    /// <summary>Puts a stop at its cheapest position that keeps the route within the hard rules; an optional stop only when that costs less than leaving it out.</summary>
    private static void Reinsert(Instance instance, List<int>[] routes, int stop, ref long work)
    {
        int bestVehicle = -1, bestPosition = -1;
        double bestDelta = instance.MayDrop(stop) ? CostModel.UnservedObjective(instance, stop) : double.PositiveInfinity;
        var trial = new int[instance.StopCount + 1];
        for (int v = 0; v < routes.Length; v++)
        {
            var route = routes[v];
            double before = CostModel.RouteObjective(instance, v, RouteScheduler.Measure(instance, v, route.ToArray()));
            for (int p = 0; p <= route.Count; p++)
            {
                int n = 0;
                for (int j = 0; j < route.Count; j++)
                {
                    if (j == p)
                    {
                        trial[n++] = stop;
                    }

                    trial[n++] = route[j];
                }

                if (p == route.Count)
                {
                    trial[n++] = stop;
                }

                var m = RouteScheduler.Measure(instance, v, trial.AsSpan(0, n));
                work += n;
                if (!CostModel.RouteFeasible(instance, m))
                {
                    continue;
                }

                double delta = CostModel.RouteObjective(instance, v, m) - before;
                if (delta < bestDelta)
                {
                    bestDelta = delta;
                    bestVehicle = v;
                    bestPosition = p;
                }
            }
        }

        if (bestVehicle >= 0)
        {
            routes[bestVehicle].Insert(bestPosition, stop);
        }
    }

    private static double TotalDemand(Instance instance, int stop)
    {
        double total = 0;
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            total += instance.Demand(stop, d);
        }

        return total;
    }
}
