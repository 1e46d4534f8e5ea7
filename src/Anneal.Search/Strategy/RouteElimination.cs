using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Vehicle reduction: empty the route with the fewest stops and leave its stops unserved, so that the search must
/// reinsert them elsewhere under penalties (the route-minimisation idea of ejection pools, e.g. Nagata &amp; Bräysy 2009).
/// Worth it only when vehicles cost something: vehicles-then-distance, or fixed costs.
/// </summary>
public static class RouteElimination
{
    public static bool Applies(Instance instance)
    {
        if (instance.Objective == Objective.VehiclesThenDistance)
        {
            return true;
        }

        if (instance.Objective != Objective.Cost)
        {
            return false;
        }

        foreach (var v in instance.Vehicles)
        {
            if (v.FixedCost > 0)
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>Removes the smallest non-empty route (ties broken at random); false when at most one route is in use.</summary>
    public static bool EmptySmallest(SearchState state, Random rng)
    {
        int smallest = -1;
        int used = 0;
        int ties = 0;
        for (int r = 0; r < state.RouteCount; r++)
        {
            int len = state.Length(r);
            if (len == 0)
            {
                continue;
            }

            used++;
            if (smallest < 0 || len < state.Length(smallest))
            {
                smallest = r;
                ties = 1;
            }
            else if (len == state.Length(smallest) && rng.Next(++ties) == 0)
            {
                smallest = r;
            }
        }

        if (used <= 1)
        {
            return false;
        }

        var routes = new List<PlannedRoute>();
        for (int r = 0; r < state.RouteCount; r++)
        {
            if (r != smallest && state.Length(r) > 0)
            {
                routes.Add(new PlannedRoute(r, state.Route(r).ToArray()));
            }
        }

        state.Load(new Plan(routes));
        return true;
    }
}
