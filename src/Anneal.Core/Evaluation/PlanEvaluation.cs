namespace Anneal.Core.Evaluation;

/// <summary>Each part of the objective; parts the objective does not count are zero.</summary>
public sealed record CostBreakdown
{
    public double Fixed { get; init; }
    public double Distance { get; init; }
    public double Time { get; init; }

    /// <summary>The vehicle count's share under vehicles-then-distance (vehicles × the vehicle weight).</summary>
    public double Vehicles { get; init; }

    public double Lateness { get; init; }
    public double Overload { get; init; }
    public double Overtime { get; init; }
    public double DurationExcess { get; init; }

    /// <summary>Minutes over soft driving rules (the day's driving, the duty span), at each rule set's price.</summary>
    public double DrivingOver { get; init; }
    public double Unserved { get; init; }

    /// <summary>The prices of changing the given plan of a re-plan (stops moved to another vehicle, starts moved beyond the tolerance).</summary>
    public double Stability { get; init; }

    public double Total => Fixed + Distance + Time + Vehicles + Lateness + Overload + Overtime + DurationExcess + DrivingOver + Unserved + Stability;
}

/// <summary>A broken rule: which rule, where, by how much, in words.</summary>
public sealed record Violation(RuleKind Rule, bool Hard, string? Vehicle, string? Stop, double Amount, string Message);

public sealed record RouteEvaluation(
    int Vehicle,
    int[] Stops,
    RouteMetrics Metrics,
    VisitTimes[] Visits,
    double[][] LoadAfter,
    double Objective,
    bool Feasible)
{
    /// <summary>The breaks planned into the route, in order (none without driving rules).</summary>
    public IReadOnlyList<DrivingRules.PlannedBreak> Breaks { get; init; } = [];
}

public sealed record PlanEvaluation(
    IReadOnlyList<RouteEvaluation> Routes,
    IReadOnlyList<int> Unserved,
    CostBreakdown Breakdown,
    IReadOnlyList<Violation> Violations)
{
    public double Objective => Breakdown.Total;

    /// <summary>
    /// Stops that must be served (not optional, unserved rule hard) and are not served on a route that keeps every
    /// hard rule: those on no route and those on a route that cannot be driven as planned.
    /// </summary>
    public int Stranded { get; init; }

    /// <summary>No hard rule is broken.</summary>
    public bool Feasible
    {
        get
        {
            foreach (var v in Violations)
            {
                if (v.Hard)
                {
                    return false;
                }
            }

            return true;
        }
    }

    /// <summary>This plan comes strictly before <paramref name="other"/> in <see cref="PlanRanking"/>'s order.</summary>
    public bool IsBetterThan(PlanEvaluation other) => PlanRanking.IsBetter(this, other);

    public int VehiclesUsed => Routes.Count(r => r.Stops.Length > 0);
    public double Distance => Routes.Sum(r => r.Metrics.Distance);
    public double Duration => Routes.Sum(r => r.Metrics.Duration);
}
