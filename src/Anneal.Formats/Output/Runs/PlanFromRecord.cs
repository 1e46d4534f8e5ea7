using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Formats.Output.Runs;

/// <summary>Turns run.json's routes (ids) back into a plan on a freshly read instance.</summary>
public static class PlanFromRecord
{
    /// <summary>The plan, or null with the ids the instance no longer knows (the input changed since the run).</summary>
    public static Plan? Build(Instance instance, IReadOnlyList<RouteRecord> routes, out IReadOnlyList<string> missing)
    {
        var vehicles = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            vehicles[instance.Vehicles[v].Id] = v;
        }

        var stops = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int s = 0; s < instance.StopCount; s++)
        {
            stops[instance.Stops[s].Id] = s;
        }

        var unknown = new List<string>();
        var planned = new List<PlannedRoute>(routes.Count);
        foreach (var route in routes)
        {
            if (!vehicles.TryGetValue(route.Vehicle, out int v))
            {
                unknown.Add("vehicle " + route.Vehicle);
                continue;
            }

            var indices = new int[route.Stops.Count];
            for (int k = 0; k < indices.Length; k++)
            {
                if (!stops.TryGetValue(route.Stops[k], out indices[k]))
                {
                    unknown.Add("stop " + route.Stops[k]);
                }
            }

            planned.Add(new PlannedRoute(v, indices));
        }

        missing = unknown;
        if (unknown.Count > 0)
        {
            return null;
        }

        var plan = new Plan(planned);
        return plan.StructureErrors(instance).Count == 0 ? plan : null;
    }
}
