using Anneal.Reports.Plots;
using Anneal.Reports.Traces;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>The plain-words line on which answer to use: how fast a good answer came, and how sure we are of it.</summary>
public static class Advice
{
    /// <summary>Seconds to reach within 1% of a solver's own final value (common practice for "time to a good answer").</summary>
    public const double Within = 0.01;

    /// <summary>Plain text (not encoded); the page encodes it.</summary>
    public static string For(ReportInput input)
    {
        var chosen = input.Chosen;
        if (chosen is null)
        {
            return input.Plan.Feasible
                ? "This plan was given, not searched for: it breaks no hard rule; compare its cost with a `solve` run."
                : "This plan was given, not searched for, and it breaks hard rules: see what breaks below.";
        }

        if (!chosen.Feasible)
        {
            return $"No solver found a plan that keeps every hard rule in the time given. The plan below, from {chosen.Solver}, is the best of the infeasible ones: "
                + "see what breaks below, then relax a rule, add a vehicle or give more time.";
        }

        var parts = new List<string> { $"Use the plan from {chosen.Solver} (objective {Money(chosen.Objective)})" };
        var fastest = Fastest(input.Solvers, chosen.Objective);
        if (fastest is { } f)
        {
            double gap = Math.Abs(chosen.Objective) > 1e-12 ? Math.Max(0, (f.Value - chosen.Objective) / Math.Abs(chosen.Objective) * 100) : 0;
            parts.Add(gap < 0.005
                ? $"{f.Run.Solver} found it in {Seconds(f.Seconds)}"
                : $"{f.Run.Solver} reached within {Percent(gap)} of the best in {Seconds(f.Seconds)}");
        }

        var bound = ConvergencePlot.Bound(input.Solvers);
        if (bound is { } b && TraceFacts.GapPercent(chosen.Objective, b.Value) is { } g)
        {
            parts.Add(g < 0.005
                ? $"{b.Solver} proved this plan optimal"
                : $"{b.Solver} proved the best is at most {Percent(g)} from optimal");
        }
        else
        {
            parts.Add("no solver proved a lower bound, so how far it is from optimal is not known");
        }

        return string.Join("; ", parts) + ".";
    }

    /// <summary>The feasible solver that first came within 1% of the best plan, when and at what value.</summary>
    private static (SolverRun Run, double Seconds, double Value)? Fastest(IReadOnlyList<SolverRun> solvers, double best)
    {
        (SolverRun, double, double)? found = null;
        foreach (var s in solvers)
        {
            if (TraceFacts.SecondsToWithin(s.Trace, best, feasible: true, Within) is { } t && (found is null || t < found.Value.Item2))
            {
                found = (s, t, ValueAt(s, t));
            }
        }

        return found;
    }

    private static double ValueAt(SolverRun s, double seconds)
    {
        double value = double.PositiveInfinity;
        foreach (var p in s.Trace)
        {
            if (p.Seconds <= seconds && p.BestFeasible)
            {
                value = Math.Min(value, p.BestObjective);
            }
        }

        return value;
    }
}
