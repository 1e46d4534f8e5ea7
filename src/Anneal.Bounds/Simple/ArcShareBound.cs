using Anneal.Bounds.Relaxation;
using Anneal.Bounds.Safety;
using Anneal.Bounds.Vehicles;
using Anneal.Core.Model;

namespace Anneal.Bounds.Simple;

/// <summary>
/// A bound that needs no LP, available at any size: the fixed costs of the fewest vehicles the plan needs, plus for
/// every stop half of its cheapest way in and half of its cheapest way out (each arc of a plan is the way out of at
/// most one stop and the way in of at most one, and no arc costs less than nothing), or the price of leaving it out
/// where it may be left out (common practice; the degree relaxation of the travelling-salesman problem).
/// </summary>
public static class ArcShareBound
{
    public static double Compute(RelaxedInstance relaxed, VehicleCount vehicles, CancellationToken cancel)
    {
        var instance = relaxed.Instance;
        double fixedPart = FixedPart(relaxed, vehicles.Vehicles);
        double total = relaxed.Constant + fixedPart;
        double magnitude = total;
        int n = relaxed.StopCount;
        for (int i = 0; i < n; i++)
        {
            if (cancel.IsCancellationRequested)
            {
                return double.NaN;
            }

            if (!relaxed.Required[i] && relaxed.DropPrice[i] == 0)
            {
                continue;
            }

            double cheapestIn = double.PositiveInfinity, cheapestOut = double.PositiveInfinity;
            foreach (var kind in relaxed.Kinds)
            {
                if (!kind.Serves[i])
                {
                    continue;
                }

                cheapestIn = Math.Min(cheapestIn, relaxed.ArcCost(kind, kind.Start, i));
                cheapestOut = Math.Min(cheapestOut, relaxed.ArcCost(kind, i, kind.End));
                for (int j = 0; j < n; j++)
                {
                    if (j != i && kind.Serves[j])
                    {
                        cheapestIn = Math.Min(cheapestIn, relaxed.ArcCost(kind, j, i));
                        cheapestOut = Math.Min(cheapestOut, relaxed.ArcCost(kind, i, j));
                    }
                }
            }

            double share = 0.5 * (cheapestIn + cheapestOut);
            if (!relaxed.Required[i])
            {
                share = Math.Min(share, relaxed.DropPrice[i]);
            }

            if (double.IsFinite(share))
            {
                total += share;
                magnitude += share;
            }
        }

        return SafeRounding.Down(total, magnitude);
    }

    /// <summary>What the fewest vehicles cost just for being used: the cheapest fixed costs, or the vehicle weight each.</summary>
    public static double FixedPart(RelaxedInstance relaxed, int vehicles)
    {
        var instance = relaxed.Instance;
        return instance.Objective switch
        {
            Objective.Cost => VehicleBound.CheapestFleet(instance, vehicles, v => v.FixedCost),
            Objective.VehiclesThenDistance => vehicles * instance.VehicleWeight,
            _ => 0,
        };
    }
}
