using Anneal.Core.Model;

namespace Anneal.Core.Evaluation;

/// <summary>
/// The load on board along one route. The vehicle leaves with every delivery that comes from the depot; at each stop
/// it unloads the stop's demand and takes on what the stop collects (returns ride to the depot, a pair's goods to its
/// delivery stop). Capacity holds when the largest load at any point is within it (Dethloff 2001, OR Spektrum
/// 23(1):79-96, for simultaneous delivery and pickup), not only the route total.
/// </summary>
public static class RouteLoads
{
    /// <summary>The amount over capacity, summed over dimensions, at the route's fullest point per dimension.</summary>
    public static double Overload(Instance instance, int vehicle, ReadOnlySpan<int> stops)
    {
        int dims = instance.DimensionCount;
        double overload = 0;
        for (int d = 0; d < dims; d++)
        {
            double capacity = instance.CapacityFlat[(vehicle * dims) + d];
            if (!instance.HasPickups)
            {
                // Delivery only: the load only falls, so the departure is the fullest point.
                double total = 0;
                for (int k = 0; k < stops.Length; k++)
                {
                    total += instance.DemandFlat[(stops[k] * dims) + d];
                }

                overload += Math.Max(0, total - capacity);
                continue;
            }

            double load = Departure(instance, stops, d);
            double peak = load;
            for (int k = 0; k < stops.Length; k++)
            {
                int s = stops[k];
                load += instance.PickupFlat[(s * dims) + d] - instance.DemandFlat[(s * dims) + d];
                peak = Math.Max(peak, load);
            }

            overload += Math.Max(0, peak - capacity);
        }

        return overload;
    }

    /// <summary>Load on board when the vehicle leaves the depot, in one dimension.</summary>
    public static double Departure(Instance instance, ReadOnlySpan<int> stops, int dimension)
    {
        double load = 0;
        for (int k = 0; k < stops.Length; k++)
        {
            load += instance.DepotLoad(stops[k], dimension);
        }

        return load;
    }

    /// <summary>Per stop, the load on board after it (one value per dimension).</summary>
    public static double[][] After(Instance instance, ReadOnlySpan<int> stops)
    {
        int dims = instance.DimensionCount;
        var load = new double[dims];
        for (int d = 0; d < dims; d++)
        {
            load[d] = Departure(instance, stops, d);
        }

        var after = new double[stops.Length][];
        for (int k = 0; k < stops.Length; k++)
        {
            for (int d = 0; d < dims; d++)
            {
                load[d] += instance.Pickup(stops[k], d) - instance.Demand(stops[k], d);
            }

            after[k] = (double[])load.Clone();
        }

        return after;
    }

    /// <summary>
    /// Stops of the route whose pair is broken on it: a delivery whose collection is not earlier on the same route, or a
    /// collection whose delivery is not later on it. A pair split over two routes counts once on each.
    /// </summary>
    public static int PairBreaks(Instance instance, ReadOnlySpan<int> stops)
    {
        if (!instance.HasPairs)
        {
            return 0;
        }

        int breaks = 0;
        for (int k = 0; k < stops.Length; k++)
        {
            if (BrokenAt(instance, stops, k))
            {
                breaks++;
            }
        }

        return breaks;
    }

    /// <summary>True when the stop at position k has a partner that is not where the pair needs it on this route.</summary>
    public static bool BrokenAt(Instance instance, ReadOnlySpan<int> stops, int k)
    {
        int s = stops[k];
        int partner = instance.PartnerOf[s];
        if (partner < 0)
        {
            return false;
        }

        bool collection = instance.Stops[s].CollectFrom < 0;
        int from = collection ? k + 1 : 0;
        int to = collection ? stops.Length : k;
        for (int j = from; j < to; j++)
        {
            if (stops[j] == partner)
            {
                return false;
            }
        }

        return true;
    }
}
