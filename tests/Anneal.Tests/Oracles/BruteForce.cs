using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Tests.Oracles;

/// <summary>
/// The one oracle of tiny instances, by enumeration, judged by the evaluator: <see cref="Optimum"/>, the best plan
/// that keeps the hard rules, and <see cref="Best"/>, the first plan of all in the evaluator's ranking (feasible or not).
/// </summary>
internal static class BruteForce
{
    /// <summary>
    /// The best plan in the evaluator's ranking: every order of the stops cut into one segment per vehicle (in fleet
    /// order) plus a last segment of stops left unserved.
    /// </summary>
    public static PlanEvaluation Best(Instance instance)
    {
        int n = instance.StopCount;
        int vehicles = instance.Vehicles.Count;
        var order = Enumerable.Range(0, n).ToArray();
        PlanEvaluation? best = null;
        var cuts = new int[vehicles + 1];
        do
        {
            Cut(instance, order, cuts, 0, 0, ref best);
        }
        while (NextPermutation(order));

        return best!;
    }

    /// <summary>
    /// The optimum among plans that keep the hard rules (null when none does): for each vehicle and each subset of
    /// stops the best feasible order (all permutations), then every assignment of stops to a vehicle or to
    /// "unserved". Route costs come from the evaluator's own route measure and cost model; the winner is re-judged
    /// by PlanEvaluator.
    /// </summary>
    public static (Plan Plan, double Objective)? Optimum(Instance instance)
    {
        int n = instance.StopCount;
        int k = instance.Vehicles.Count;
        var best = new double[k][];
        var order = new int[k][][];
        for (int v = 0; v < k; v++)
        {
            best[v] = new double[1 << n];
            order[v] = new int[1 << n][];
            for (int mask = 1; mask < 1 << n; mask++)
            {
                (best[v][mask], order[v][mask]) = BestOrder(instance, v, mask);
            }
        }

        var masks = new int[k];
        double bestTotal = double.PositiveInfinity;
        int[]? bestMasks = null;
        void Assign(int stop, double dropped)
        {
            if (stop == n)
            {
                double total = dropped;
                for (int v = 0; v < k; v++)
                {
                    total += masks[v] == 0 ? 0 : best[v][masks[v]];
                }

                if (total < bestTotal - 1e-9)
                {
                    bestTotal = total;
                    bestMasks = (int[])masks.Clone();
                }

                return;
            }

            if (instance.MayDrop(stop))
            {
                Assign(stop + 1, dropped + instance.UnservedPrice(stop));
            }

            for (int v = 0; v < k; v++)
            {
                masks[v] |= 1 << stop;
                Assign(stop + 1, dropped);
                masks[v] &= ~(1 << stop);
            }
        }

        Assign(0, 0);
        if (bestMasks is null)
        {
            return null;
        }

        var routes = new List<PlannedRoute>();
        for (int v = 0; v < k; v++)
        {
            if (bestMasks[v] != 0)
            {
                routes.Add(new PlannedRoute(v, order[v][bestMasks[v]]));
            }
        }

        var plan = new Plan(routes);
        var judged = PlanEvaluator.Evaluate(instance, plan);
        Assert.True(judged.Feasible);
        return (plan, judged.Objective);
    }

    private static (double, int[]) BestOrder(Instance instance, int vehicle, int mask)
    {
        var stops = new List<int>();
        for (int s = 0; s < instance.StopCount; s++)
        {
            if ((mask & (1 << s)) != 0)
            {
                stops.Add(s);
            }
        }

        var perm = stops.ToArray();
        double best = double.PositiveInfinity;
        int[] bestOrder = (int[])perm.Clone();
        var c = new int[perm.Length];
        void Consider()
        {
            var m = RouteScheduler.Measure(instance, vehicle, perm);
            if (CostModel.RouteFeasible(instance, m))
            {
                double cost = CostModel.RouteObjective(instance, vehicle, m);
                if (cost < best - 1e-9)
                {
                    best = cost;
                    bestOrder = (int[])perm.Clone();
                }
            }
        }

        // Heap's algorithm (Heap 1963, "Permutations by interchanges", The Computer Journal 6(3):293-294).
        Consider();
        int i = 0;
        while (i < perm.Length)
        {
            if (c[i] < i)
            {
                int j = i % 2 == 0 ? 0 : c[i];
                (perm[j], perm[i]) = (perm[i], perm[j]);
                Consider();
                c[i]++;
                i = 0;
            }
            else
            {
                c[i] = 0;
                i++;
            }
        }

        return (best, bestOrder);
    }

    // cuts[k] = first position of segment k; segment `vehicles` holds the unserved stops.
    private static void Cut(Instance instance, int[] order, int[] cuts, int segment, int from, ref PlanEvaluation? best)
    {
        int vehicles = instance.Vehicles.Count;
        if (segment == vehicles)
        {
            for (int k = from; k < order.Length; k++)
            {
                if (!instance.MayDrop(order[k]) || (k > from && order[k] < order[k - 1]))
                {
                    return; // unserved set: only droppable stops, each set counted once (ascending)
                }
            }

            var routes = new List<PlannedRoute>();
            for (int v = 0; v < vehicles; v++)
            {
                int end = v + 1 < vehicles ? cuts[v + 1] : from;
                if (end > cuts[v])
                {
                    routes.Add(new PlannedRoute(v, order[cuts[v]..end]));
                }
            }

            var e = PlanEvaluator.Evaluate(instance, new Plan(routes));
            if (best is null || e.IsBetterThan(best))
            {
                best = e;
            }

            return;
        }

        for (int end = from; end <= order.Length; end++)
        {
            cuts[segment] = from;
            Cut(instance, order, cuts, segment + 1, end, ref best);
        }
    }

    private static bool NextPermutation(int[] a)
    {
        int i = a.Length - 2;
        while (i >= 0 && a[i] >= a[i + 1])
        {
            i--;
        }

        if (i < 0)
        {
            return false;
        }

        int j = a.Length - 1;
        while (a[j] <= a[i])
        {
            j--;
        }

        (a[i], a[j]) = (a[j], a[i]);
        Array.Reverse(a, i + 1, a.Length - i - 1);
        return true;
    }
}
