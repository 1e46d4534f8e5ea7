using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Core.Evaluation;

/// <summary>Words for every broken collect-and-deliver pair of a plan, one violation per pair, naming its stops.</summary>
internal static class PairReport
{
    public static void Add(Instance instance, Plan plan, List<Violation> violations)
    {
        if (!instance.HasPairs)
        {
            return;
        }

        var routeOf = new int[instance.StopCount];
        var positionOf = new int[instance.StopCount];
        Array.Fill(routeOf, -1);
        for (int r = 0; r < plan.Routes.Count; r++)
        {
            var stops = plan.Routes[r].Stops;
            for (int k = 0; k < stops.Length; k++)
            {
                routeOf[stops[k]] = r;
                positionOf[stops[k]] = k;
            }
        }

        for (int d = 0; d < instance.StopCount; d++)
        {
            int c = instance.Stops[d].CollectFrom;
            if (c < 0 || (routeOf[d] < 0 && routeOf[c] < 0))
            {
                continue;
            }

            string message = Reason(instance, plan, c, d, routeOf, positionOf) ?? string.Empty;
            if (message.Length > 0)
            {
                int r = routeOf[d] >= 0 ? routeOf[d] : routeOf[c];
                string vehicle = instance.Vehicles[plan.Routes[r].Vehicle].Id;
                violations.Add(new Violation(RuleKind.Pair, true, vehicle, instance.Stops[routeOf[d] >= 0 ? d : c].Id, 1, message));
            }
        }
    }

    private static string? Reason(Instance instance, Plan plan, int c, int d, int[] routeOf, int[] positionOf)
    {
        string collect = instance.Stops[c].Id;
        string deliver = instance.Stops[d].Id;
        string VehicleOf(int stop) => instance.Vehicles[plan.Routes[routeOf[stop]].Vehicle].Id;
        if (routeOf[c] < 0)
        {
            return $"stop {deliver} delivers what stop {collect} collects, but {collect} is on no route";
        }

        if (routeOf[d] < 0)
        {
            return $"stop {collect} collects for stop {deliver}, but {deliver} is on no route";
        }

        if (routeOf[c] != routeOf[d])
        {
            return $"stop {deliver} (vehicle {VehicleOf(d)}) delivers what stop {collect} collects, but {collect} is on vehicle {VehicleOf(c)}";
        }

        if (positionOf[c] > positionOf[d])
        {
            return $"stop {deliver} is served at position {positionOf[d] + 1} of vehicle {VehicleOf(d)}, before stop {collect} (position {positionOf[c] + 1}) collects what it delivers";
        }

        return null;
    }
}
