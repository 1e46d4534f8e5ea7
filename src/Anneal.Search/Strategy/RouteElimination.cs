using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Vehicle reduction: empty a route with few stops and leave its stops unserved, so that the search must
/// reinsert them elsewhere under penalties (the route-minimisation idea of ejection pools, e.g. Nagata &amp; Bräysy 2009).
/// Worth it only when vehicles cost something: vehicles-then-distance, or fixed costs.
/// </summary>
public static class RouteElimination
{
    public static bool Applies(Instance instance) => instance.Costs.VehiclesCost;

    /// <summary>How many of the shortest routes an elimination attempt chooses among.</summary>
    public const int Choices = 3;

    /// <summary>
    /// Empties one of the <see cref="Choices"/> shortest routes, chosen at random: always taking the very shortest
    /// repeats the same failed attempt after every repair. False when at most one route is in use.
    /// </summary>
    public static bool EmptyAShortRoute(SearchState state, Random rng)
    {
        var used = new List<(int Length, int Route)>();
        for (int r = 0; r < state.RouteCount; r++)
        {
            if (state.Length(r) > 0)
            {
                used.Add((state.Length(r), r));
            }
        }

        if (used.Count <= 1)
        {
            return false;
        }

        used.Sort();
        int chosen = used[rng.Next(Math.Min(Choices, used.Count))].Route;
        var routes = new List<PlannedRoute>();
        for (int r = 0; r < state.RouteCount; r++)
        {
            if (r != chosen && state.Length(r) > 0)
            {
                routes.Add(new PlannedRoute(r, state.Route(r).ToArray()));
            }
        }

        state.Load(new Plan(routes));
        return true;
    }
}
