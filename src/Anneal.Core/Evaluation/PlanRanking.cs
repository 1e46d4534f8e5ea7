namespace Anneal.Core.Evaluation;

/// <summary>
/// The one order of plans. Every place that picks one plan over another calls it: a solver keeping its best, the
/// copies of a solver run side by side, and the run choosing among solvers. A plan comes first when, in turn:
/// <list type="number">
/// <item>it exists (a solver that found no plan is never chosen over one that did);</item>
/// <item>it keeps every hard rule;</item>
/// <item>between plans that break hard rules: it serves more of the stops that must be served on routes that keep
/// every hard rule (<see cref="PlanEvaluation.Stranded"/>: a stop on a route that cannot be driven as planned is not
/// served in any useful sense, so an overloaded van carrying the whole day does not beat a full one and a list of
/// stops left over);</item>
/// <item>then it breaks the hard rules other than serving by less in all (minutes late or over the shift end or
/// maximum duration, units over capacity and items of missing equipment, added up);</item>
/// <item>its objective is lower;</item>
/// <item>its distance is shorter (an objective that cannot tell plans apart, such as a cost without prices);</item>
/// <item>its duration is shorter.</item>
/// </list>
/// Plans equal on all of these tie; the caller keeps the one it had first. Pure: no state, no I/O.
/// </summary>
public static class PlanRanking
{
    /// <summary>Relative difference below which two numbers are taken as equal (rounding, not a better plan).</summary>
    private const double Relative = 1e-9;

    /// <summary>Negative when <paramref name="a"/> comes first, positive when <paramref name="b"/> does, 0 on a tie. Null means no plan.</summary>
    public static int Compare(PlanEvaluation? a, PlanEvaluation? b)
    {
        if (a is null || b is null)
        {
            return (a is null ? 1 : 0) - (b is null ? 1 : 0);
        }

        bool feasibleA = a.Feasible, feasibleB = b.Feasible;
        if (feasibleA != feasibleB)
        {
            return feasibleA ? -1 : 1;
        }

        if (!feasibleA)
        {
            var (missedA, excessA) = HardBreaks(a);
            var (missedB, excessB) = HardBreaks(b);
            if (missedA != missedB)
            {
                return missedA < missedB ? -1 : 1;
            }

            int byExcess = Order(excessA, excessB);
            if (byExcess != 0)
            {
                return byExcess;
            }
        }

        int c = Order(a.Objective, b.Objective);
        if (c == 0)
        {
            c = Order(a.Distance, b.Distance);
        }

        return c != 0 ? c : Order(a.Duration, b.Duration);
    }

    /// <summary>True when <paramref name="candidate"/> comes strictly before <paramref name="incumbent"/>.</summary>
    public static bool IsBetter(PlanEvaluation? candidate, PlanEvaluation? incumbent) => Compare(candidate, incumbent) < 0;

    /// <summary>Index of the first plan that nothing after it beats (0 for an empty or all-null list).</summary>
    public static int Best(IReadOnlyList<PlanEvaluation?> plans)
    {
        int best = 0;
        for (int k = 1; k < plans.Count; k++)
        {
            if (IsBetter(plans[k], plans[best]))
            {
                best = k;
            }
        }

        return best;
    }

    /// <summary>Stops that must be served but are not on a drivable route, and the summed amount of every other broken hard rule.</summary>
    public static (int Stranded, double Excess) HardBreaks(PlanEvaluation plan)
    {
        double excess = 0;
        foreach (var v in plan.Violations)
        {
            if (v.Hard && v.Rule != RuleKind.Unserved)
            {
                excess += v.Amount;
            }
        }

        return (plan.Stranded, excess);
    }

    /// <summary>Lower first; values within a relative 1e-9 of each other tie. NaN sorts last.</summary>
    private static int Order(double a, double b)
    {
        if (double.IsNaN(a) || double.IsNaN(b))
        {
            return (double.IsNaN(a) ? 1 : 0) - (double.IsNaN(b) ? 1 : 0);
        }

        if (a == b)
        {
            return 0;
        }

        double scale = Math.Max(1.0, Math.Max(Math.Abs(a), Math.Abs(b)));
        if (double.IsInfinity(scale))
        {
            return a < b ? -1 : 1;
        }

        return Math.Abs(a - b) <= Relative * scale ? 0 : a < b ? -1 : 1;
    }
}
