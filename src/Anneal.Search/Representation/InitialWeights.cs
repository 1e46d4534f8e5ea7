using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Search.Representation;

/// <summary>Starting prices for hard-rule violations, scaled to the instance's typical arc cost.</summary>
public static class InitialWeights
{
    public static PenaltyWeights For(Instance instance, double factor)
    {
        double arc = TypicalArcCost(instance);
        return PenaltyWeights.Uniform(Math.Max(1e-6, arc * factor / 10));
    }

    /// <summary>
    /// Prices for the construction heuristic: dear enough that breaking a hard rule never beats opening a route,
    /// whatever a route costs under the objective (the vehicle weight, a fixed cost).
    /// </summary>
    public static PenaltyWeights ForConstruction(Instance instance) =>
        PenaltyWeights.Uniform(Math.Max(TypicalArcCost(instance) * 1000, RouteOpeningCost(instance) * 10));

    /// <summary>Upper bound for adaptive prices: a violation must be able to outweigh a whole route.</summary>
    public static double Ceiling(Instance instance) => Math.Max(TypicalArcCost(instance) * 1e4, RouteOpeningCost(instance) * 10);

    /// <summary>What using one more vehicle costs under the objective, before distance.</summary>
    public static double RouteOpeningCost(Instance instance)
    {
        double most = 0;
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            most = Math.Max(most, instance.Costs.Rates(v).Fixed);
        }

        return most;
    }

    /// <summary>Mean cost of a depot-to-stop arc under the objective (distance, or money per km for cost).</summary>
    public static double TypicalArcCost(Instance instance)
    {
        int n = instance.StopCount;
        if (n == 0 || instance.Depots.Count == 0)
        {
            return 1;
        }

        double sum = 0;
        int depot = instance.DepotLocation(0);
        for (int i = 0; i < n; i++)
        {
            sum += instance.Travel.Distance(depot, i);
        }

        double perKm = 1;
        if (instance.Vehicles.Count > 0)
        {
            // 1 under the benchmark objectives, whose rates are 1 per distance and nothing per time.
            var rates = instance.Costs.Rates(0);
            perKm = Math.Max(rates.PerDistance + (rates.PerTime * instance.Travel.TimePerDistance), 1e-3);
        }

        return Math.Max(1e-6, sum / n * perKm);
    }
}
