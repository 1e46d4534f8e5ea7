using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Reports.Plots;
using Anneal.Reports.Traces;
using static Anneal.Reports.Html.Text;

namespace Anneal.Reports.Html;

/// <summary>
/// The report's headline in plain words: whose plan, what it costs, how soon it was nearly that good and how far from
/// the best possible it may be; on a day that cannot be fully served, what cannot be done and why.
/// </summary>
public static class Advice
{
    /// <summary>Seconds to reach within 1% of a solver's own final value (common practice for "time to a good answer").</summary>
    public const double Within = 0.01;

    /// <summary>How many screening reasons the headline names before pointing to the list.</summary>
    private const int ReasonsShown = 3;

    /// <summary>Plain text (not encoded); the page encodes it.</summary>
    public static string For(ReportInput input)
    {
        var chosen = input.Chosen;
        var obstacles = input.Obstacles;
        if (input.Solvers.Count == 0)
        {
            return input.Plan.Feasible
                ? "This plan was given, not searched for: it breaks no hard rule; compare its cost with a `solve` run."
                : "This plan was given, not searched for, and it breaks hard rules" + Why(obstacles, " because ") + " See what breaks below.";
        }

        if (chosen is null || !chosen.HasPlan)
        {
            return "No solver found any plan in the time given" + Why(obstacles, ": ") + " Give more time, or relax a rule.";
        }

        if (!input.Plan.Feasible)
        {
            int stops = input.Instance.StopCount, served = stops - input.Plan.Unserved.Count;
            int hard = input.Plan.Violations.Count(v => v.Hard);
            string why = obstacles.Count > 0
                ? "No plan can keep every hard rule: " + Reasons(obstacles) + "."
                : "No solver found a plan that keeps every hard rule in the time given; the screening found no single cause, "
                    + "so the rules may be too tight together for the fleet (more time may still find one).";
            return $"{why} The plan below, {chosen.Solver}'s, serves {served} of {stops} stops and breaks {Plural(hard, "hard rule")} (listed under What breaks): "
                + "a dispatcher decides what to do about them, or relaxes a rule, adds a vehicle and solves again.";
        }

        var parts = new List<string> { Costs(input, chosen) };
        if (TraceFacts.SecondsToWithin(chosen.Trace, chosen.Objective!.Value, feasible: true, Within) is { } t)
        {
            parts.Add($"it was within 1% of that after {Seconds(t)}");
        }

        var bound = ConvergencePlot.Bound(input.Solvers);
        string better = input.Instance.Objective == Objective.Cost ? "cheaper" : "better";
        if (bound is { } b && TraceFacts.GapPercent(chosen.Objective.Value, b.Value) is { } g)
        {
            parts.Add(g < 0.005
                ? $"{b.Solver} proved that no plan is {better}"
                : $"{b.Solver} proved that no plan is more than {Percent(g)} {better}");
        }
        else
        {
            parts.Add($"how much {better} the best possible plan is, is not known (no solver proved a lower bound)");
        }

        return string.Join("; ", parts) + ".";
    }

    /// <summary>"sa's plan costs 1,418.20", in the objective's own terms.</summary>
    private static string Costs(ReportInput input, SolverRun chosen)
    {
        double objective = chosen.Objective!.Value;
        string km = input.Instance.Units.DistanceSuffix;
        return input.Instance.Objective switch
        {
            Objective.Cost => $"{chosen.Solver}'s plan costs {Money(objective)}",
            Objective.Distance when Math.Abs(objective - input.Plan.Distance) < 1e-6 => $"{chosen.Solver}'s plan drives {Num(objective, "#,0.0")}{km}",
            Objective.Distance => $"{chosen.Solver}'s plan scores {Money(objective)} ({Num(input.Plan.Distance, "#,0.0")}{km} plus the prices of soft rules it breaks)",
            _ => $"{chosen.Solver}'s plan uses {Plural(input.Plan.VehiclesUsed, "vehicle")} and drives {Num(input.Plan.Distance, "#,0.0")}{km}",
        };
    }

    private static string Why(IReadOnlyList<Obstacle> obstacles, string lead) =>
        obstacles.Count == 0 ? "." : lead + Reasons(obstacles) + ".";

    private static string Reasons(IReadOnlyList<Obstacle> obstacles)
    {
        var shown = obstacles.Take(ReasonsShown).Select(o => o.Message);
        string text = string.Join("; ", shown);
        return obstacles.Count > ReasonsShown ? $"{text}; and {obstacles.Count - ReasonsShown} more (see Input screening)" : text;
    }

    private static string Plural(int n, string noun) => n == 1 ? $"1 {noun}" : $"{n} {noun}s";
}
