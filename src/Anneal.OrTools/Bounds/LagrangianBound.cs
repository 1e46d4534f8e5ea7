using Anneal.Bounds.Relaxation;
using Anneal.Bounds.Safety;

namespace Anneal.OrTools.Bounds;

/// <summary>
/// The Lagrangian bound of the route-based relaxation (Lübbecke &amp; Desrosiers 2005, "Selected topics in column
/// generation", Operations Research 53(6):1007-1023): relax every stop's covering row with its dual π ≥ 0, every kind's
/// limit with μ ≤ 0 and the fleet's lower limit with ν ≥ 0. What remains is choosing at most K_k routes of each kind
/// and leaving stops out, separately, so for any such duals
/// <code>z* ≥ Σπ + Σ_k μ_k K_k + ν V + Σ_optional min(0, price − π) + Σ_k K_k · min(0, c̄*_k)</code>
/// where c̄*_k is the least reduced cost of a route of kind k over a route set that contains every route a plan can
/// drive (here the ng-routes, priced exactly). The duals need not be optimal, and the master need not hold every
/// route: at an optimal master the bound is its LP value, and it is valid at every iteration, so an interrupted run
/// keeps it. The sum is made safe as in <see cref="SafeRounding"/>: the duals are used exactly as given (their signs
/// forced), and the floating-point error of the sum and of the pricing's sums is covered by the margin.
/// </summary>
internal static class LagrangianBound
{
    /// <param name="leastReducedCost">Per kind, the least reduced cost over all its ng-routes, with the same duals.</param>
    public static double Compute(RelaxedInstance relaxed, Duals duals, int minVehicles, double[] leastReducedCost)
    {
        double value = relaxed.Constant, magnitude = Math.Abs(relaxed.Constant), stops = 0;
        for (int i = 0; i < relaxed.StopCount; i++)
        {
            double pi = duals.Stop[i];
            double term = pi + (relaxed.Required[i] ? 0 : Math.Min(0, relaxed.DropPrice[i] - pi));
            value += term;
            magnitude += pi + relaxed.DropPrice[i];
            stops += pi;
        }

        value += duals.Fleet * minVehicles;
        magnitude += duals.Fleet * minVehicles;
        for (int k = 0; k < relaxed.Kinds.Count; k++)
        {
            double routes = RouteLimit(relaxed, k);
            double rc = Math.Min(0, leastReducedCost[k]);
            value += (duals.Kind[k] * relaxed.Kinds[k].Count) + (routes * rc);
            magnitude += (Math.Abs(duals.Kind[k]) * relaxed.Kinds[k].Count) + (routes * (Math.Abs(rc) + stops + relaxed.Kinds[k].FixedCost + Math.Abs(duals.Kind[k]) + duals.Fleet));
        }

        return SafeRounding.Down(value, magnitude);
    }

    /// <summary>At most this many routes of the kind in any plan: one per vehicle, and no more than the stops it serves.</summary>
    public static double RouteLimit(RelaxedInstance relaxed, int kind)
    {
        int served = 0;
        var k = relaxed.Kinds[kind];
        for (int i = 0; i < relaxed.StopCount; i++)
        {
            if (k.Serves[i])
            {
                served++;
            }
        }

        return Math.Min(k.Count, served);
    }
}
