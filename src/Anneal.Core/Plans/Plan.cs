namespace Anneal.Core.Plans;

/// <summary>The stops one vehicle visits, in order (depots implicit at both ends).</summary>
public sealed record PlannedRoute(int Vehicle, int[] Stops);

/// <summary>A set of routes; stops on no route are unserved. Vehicles without a route stay at the depot.</summary>
public sealed record Plan(IReadOnlyList<PlannedRoute> Routes)
{
    public static Plan Empty { get; } = new(Array.Empty<PlannedRoute>());

    public int VehiclesUsed
    {
        get
        {
            int used = 0;
            foreach (var r in Routes)
            {
                if (r.Stops.Length > 0)
                {
                    used++;
                }
            }

            return used;
        }
    }

    /// <summary>Structural problems (unknown index, a stop twice, a vehicle twice); empty when the plan is well formed.</summary>
    public IReadOnlyList<string> StructureErrors(Model.Instance instance)
    {
        var errors = new List<string>();
        var seenStop = new bool[instance.StopCount];
        var seenVehicle = new bool[instance.Vehicles.Count];
        foreach (var route in Routes)
        {
            if (route.Vehicle < 0 || route.Vehicle >= instance.Vehicles.Count)
            {
                errors.Add($"route refers to vehicle number {route.Vehicle + 1}, but the fleet has {instance.Vehicles.Count}");
                continue;
            }

            if (seenVehicle[route.Vehicle])
            {
                errors.Add($"vehicle {instance.Vehicles[route.Vehicle].Id} has more than one route");
            }

            seenVehicle[route.Vehicle] = true;
            foreach (int s in route.Stops)
            {
                if (s < 0 || s >= instance.StopCount)
                {
                    errors.Add($"route of vehicle {instance.Vehicles[route.Vehicle].Id} refers to stop number {s + 1}, but there are {instance.StopCount}");
                }
                else if (seenStop[s])
                {
                    errors.Add($"stop {instance.Stops[s].Id} is visited more than once");
                }
                else
                {
                    seenStop[s] = true;
                }
            }
        }

        return errors;
    }
}
