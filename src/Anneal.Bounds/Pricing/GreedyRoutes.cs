namespace Anneal.Bounds.Pricing;

/// <summary>
/// Seed routes for the master: each route goes from the depot to the nearest stop not yet covered that it can still
/// reach within the capacity and the hard times, until none is left (nearest neighbour, common practice). Any route
/// will do as a column; good ones only make the first duals sensible, which saves rounds.
/// </summary>
public static class GreedyRoutes
{
    /// <param name="covered">Stops already on a seed route; updated.</param>
    public static List<int[]> Build(PricingNetwork net, bool[] covered, int maxRoutes)
    {
        var routes = new List<int[]>();
        int dims = net.Dimensions;
        var load = new double[dims];
        var route = new List<int>();
        while (routes.Count < maxRoutes)
        {
            Array.Clear(load);
            route.Clear();
            int at = net.StartNode;
            double time = net.Kind.ShiftStart;
            while (true)
            {
                int next = -1;
                double nextStart = 0, nearest = double.PositiveInfinity;
                for (int s = net.SuccessorStart[at]; s < net.SuccessorStart[at + 1]; s++)
                {
                    int j = net.Successors[s];
                    if (covered[j] || !Fits(net, load, j))
                    {
                        continue;
                    }

                    double start = 0;
                    if (net.TimeMatters)
                    {
                        start = net.Starts.At(j, time + net.ArcTime(at, j));
                        if (double.IsNaN(start) || start + net.ArcTime(j, net.EndNode) > net.Kind.LatestReturn)
                        {
                            continue;
                        }
                    }

                    double cost = net.ArcCost(at, j) + (net.TimeMatters ? start - time : 0);
                    if (cost < nearest)
                    {
                        (next, nextStart, nearest) = (j, start, cost);
                    }
                }

                if (next < 0)
                {
                    break;
                }

                covered[next] = true;
                route.Add(next);
                for (int d = 0; d < dims; d++)
                {
                    load[d] += net.Demand[(next * dims) + d];
                }

                (at, time) = (next, nextStart);
            }

            if (route.Count == 0)
            {
                break;
            }

            routes.Add(route.ToArray());
        }

        return routes;
    }

    private static bool Fits(PricingNetwork net, double[] load, int j)
    {
        for (int d = 0; d < net.Dimensions; d++)
        {
            if (load[d] + net.Demand[(j * net.Dimensions) + d] > net.Capacity[d])
            {
                return false;
            }
        }

        return true;
    }
}
