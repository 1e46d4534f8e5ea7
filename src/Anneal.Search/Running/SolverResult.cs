using Anneal.Core.Plans;

namespace Anneal.Search.Running;

/// <summary>What one solver returned. The plan is judged by the evaluator, never by the solver's own numbers.</summary>
/// <param name="Status">"completed", "interrupted", "time limit", "no solution", …</param>
/// <param name="Notes">Anything a user should know (approximated rules, strategy choices).</param>
/// <param name="BoundOnly">The solver proves a lower bound and offers no plan (its plan is empty and never chosen).</param>
public sealed record SolverResult(
    string Solver,
    Plan Plan,
    double Seconds,
    double SecondsToBest,
    IReadOnlyList<TracePoint> Trace,
    string Status,
    double? LowerBound = null,
    IReadOnlyList<string>? Notes = null,
    bool BoundOnly = false)
{
    /// <summary>False when the solver found no plan at all (its <see cref="Plan"/> is then empty and must never be chosen).</summary>
    public bool HasPlan { get; init; } = !BoundOnly;
}
