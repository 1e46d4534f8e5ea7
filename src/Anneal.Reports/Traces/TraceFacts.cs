using Anneal.Core.Solving;

namespace Anneal.Reports.Traces;

/// <summary>What a convergence trace says about speed: when a solver first had a feasible plan, and when it came close to a value.</summary>
public static class TraceFacts
{
    /// <summary>Seconds of the first sample whose best plan is feasible; null when none is.</summary>
    public static double? FirstFeasible(IReadOnlyList<TracePoint> trace)
    {
        foreach (var p in trace)
        {
            if (p.BestFeasible && double.IsFinite(p.BestObjective))
            {
                return p.Seconds;
            }
        }

        return null;
    }

    /// <summary>
    /// Seconds until the best plan first came within <paramref name="fraction"/> of <paramref name="target"/>
    /// (relative to |target|), counting only samples as feasible as the target plan; null when it never did.
    /// </summary>
    public static double? SecondsToWithin(IReadOnlyList<TracePoint> trace, double target, bool feasible, double fraction)
    {
        if (!double.IsFinite(target))
        {
            return null;
        }

        double limit = target + (Math.Abs(target) * fraction);
        foreach (var p in trace)
        {
            if (p.BestFeasible == feasible && double.IsFinite(p.BestObjective) && p.BestObjective <= limit + 1e-9)
            {
                return p.Seconds;
            }
        }

        return null;
    }

    /// <summary>
    /// Relative gap between a plan's objective and a proven lower bound, in percent: (best − bound) / |best|,
    /// the relative MIP gap as branch-and-bound solvers report it (common practice). Null when either is unknown.
    /// </summary>
    public static double? GapPercent(double best, double? bound)
    {
        if (bound is not { } b || !double.IsFinite(b) || !double.IsFinite(best) || Math.Abs(best) < 1e-12)
        {
            return null;
        }

        return Math.Max(0, (best - b) / Math.Abs(best) * 100);
    }
}
