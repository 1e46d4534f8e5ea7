using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Tests.Search;

/// <summary>
/// The best plan of a tiny instance by enumeration: every order of the stops cut into one segment per vehicle
/// (in fleet order) plus a last segment of stops left unserved; judged by the evaluator's ranking.
/// </summary>
internal static class BruteForce
{
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
