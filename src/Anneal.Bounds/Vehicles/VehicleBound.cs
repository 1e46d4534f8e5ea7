using Anneal.Bounds.Relaxation;
using Anneal.Core.Model;

namespace Anneal.Bounds.Vehicles;

/// <summary>
/// Fewest vehicles any plan that keeps the hard rules can use for its required stops, from two counts (common
/// practice; both appear e.g. in Kontoravdis &amp; Bard 1995, ORSA J. Computing 7(1):10-23):
/// <list type="bullet">
/// <item>Capacity, per hard dimension: the required demand must fit into the largest vehicles taken one by one
/// (the bin-packing bound ⌈demand / capacity⌉ for a uniform fleet), each widened by the evaluator's tolerance.</item>
/// <item>Incompatible stops: two stops that no kind of vehicle can serve on one route (capacity, equipment, or their
/// windows and travel times in either order) need two vehicles; a clique of such stops, found greedily, needs one
/// vehicle each. A greedy clique is smaller than the largest, never larger than a clique, so the count stays valid.</item>
/// </list>
/// </summary>
public static class VehicleBound
{
    /// <summary>Above this many required stops the pairwise test is skipped (quadratic time and memory).</summary>
    public const int CliqueLimit = 3000;

    private const int Seeds = 32;

    public static VehicleCount Compute(RelaxedInstance relaxed)
    {
        var instance = relaxed.Instance;
        var best = new VehicleCount(0, "no stop must be served");
        var required = RequiredStops(relaxed);
        if (required.Count == 0)
        {
            return best;
        }

        best = new VehicleCount(1, "at least one stop must be served");
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            int bins = Capacity(relaxed, required, d);
            if (bins > best.Vehicles)
            {
                best = new VehicleCount(bins, $"the required {instance.DimensionNames[d]} fills no fewer than {bins} vehicles");
            }
        }

        if (required.Count <= CliqueLimit)
        {
            int clique = Clique(relaxed, required);
            if (clique > best.Vehicles)
            {
                best = new VehicleCount(clique, $"{clique} stops pairwise cannot share a route (windows, travel times, loads or equipment)");
            }
        }

        return best;
    }

    /// <summary>Sum of the <paramref name="vehicles"/> smallest values of <paramref name="price"/> over the fleet.</summary>
    public static double CheapestFleet(Instance instance, int vehicles, Func<Vehicle, double> price)
    {
        var prices = new double[instance.Vehicles.Count];
        for (int v = 0; v < prices.Length; v++)
        {
            prices[v] = price(instance.Vehicles[v]);
        }

        Array.Sort(prices);
        double sum = 0;
        for (int k = 0; k < vehicles && k < prices.Length; k++)
        {
            sum += prices[k];
        }

        return sum;
    }

    private static List<int> RequiredStops(RelaxedInstance relaxed)
    {
        var list = new List<int>();
        for (int i = 0; i < relaxed.StopCount; i++)
        {
            if (relaxed.Required[i])
            {
                list.Add(i);
            }
        }

        return list;
    }

    private static int Capacity(RelaxedInstance relaxed, List<int> required, int d)
    {
        var instance = relaxed.Instance;
        double demand = 0;
        foreach (int i in required)
        {
            demand += instance.Demand(i, d);
        }

        var caps = new double[instance.Vehicles.Count];
        int c = 0;
        foreach (var kind in relaxed.Kinds)
        {
            for (int k = 0; k < kind.Count; k++)
            {
                caps[c++] = kind.Capacity[d];
            }
        }

        Array.Sort(caps);
        Array.Reverse(caps);

        // The sum of the demands is rounded too: shave a relative margin off it before comparing.
        double need = demand * (1 - 1e-12);
        double filled = 0;
        for (int k = 0; k < caps.Length; k++)
        {
            filled += caps[k];
            if (filled >= need)
            {
                return k + 1;
            }
        }

        return caps.Length;
    }

    private static int Clique(RelaxedInstance relaxed, List<int> required)
    {
        int m = required.Count;
        var apart = new bool[m * m];
        var degree = new int[m];
        for (int a = 0; a < m; a++)
        {
            for (int b = a + 1; b < m; b++)
            {
                if (!Together(relaxed, required[a], required[b]))
                {
                    apart[(a * m) + b] = apart[(b * m) + a] = true;
                    degree[a]++;
                    degree[b]++;
                }
            }
        }

        var order = new int[m];
        for (int a = 0; a < m; a++)
        {
            order[a] = a;
        }

        Array.Sort(order, (p, q) => degree[q].CompareTo(degree[p]));
        int best = 0;
        var clique = new List<int>();
        for (int s = 0; s < Math.Min(Seeds, m); s++)
        {
            clique.Clear();
            clique.Add(order[s]);
            foreach (int c in order)
            {
                bool all = true;
                foreach (int member in clique)
                {
                    if (c == member || !apart[(c * m) + member])
                    {
                        all = false;
                        break;
                    }
                }

                if (all)
                {
                    clique.Add(c);
                }
            }

            best = Math.Max(best, clique.Count);
        }

        return best;
    }

    /// <summary>Can some kind of vehicle serve both stops on one route, in one order or the other?</summary>
    private static bool Together(RelaxedInstance relaxed, int i, int j)
    {
        var instance = relaxed.Instance;
        foreach (var kind in relaxed.Kinds)
        {
            if (!kind.Serves[i] || !kind.Serves[j])
            {
                continue;
            }

            bool fits = true;
            for (int d = 0; d < instance.DimensionCount && fits; d++)
            {
                fits = instance.Demand(i, d) + instance.Demand(j, d) <= kind.Capacity[d];
            }

            if (fits && (!kind.TimeMatters || InOrder(relaxed, kind, i, j) || InOrder(relaxed, kind, j, i)))
            {
                return true;
            }
        }

        return false;
    }

    private static bool InOrder(RelaxedInstance relaxed, RouteKind kind, int i, int j)
    {
        // Other stops may lie between the two: their times are lower bounds along any path, not the direct arcs.
        var paths = relaxed.Paths!;
        var starts = relaxed.Starts;
        double si = starts.At(i, kind.ShiftStart + paths.Between(kind.Start, i));
        if (double.IsNaN(si))
        {
            return false;
        }

        double sj = starts.At(j, si + relaxed.Service(i) + paths.Between(i, j));
        return !double.IsNaN(sj) && sj + relaxed.Service(j) + paths.Between(j, kind.End) <= kind.LatestReturn;
    }
}
