using Anneal.Core.Plans;

namespace Anneal.Core.Solving;

/// <summary>What one solver returned. The plan is judged by the evaluator, never by the solver's own numbers.</summary>
/// <param name="Status">Why it stopped (see <see cref="SolverStatus"/>).</param>
/// <param name="Notes">Anything a user should know (approximated rules, strategy choices, why it declined).</param>
/// <param name="BoundOnly">The solver proves a lower bound and offers no plan (its plan is empty and never chosen).</param>
public sealed record SolverResult(
    string Solver,
    Plan Plan,
    double Seconds,
    double SecondsToBest,
    IReadOnlyList<TracePoint> Trace,
    SolverStatus Status,
    double? LowerBound = null,
    IReadOnlyList<string>? Notes = null,
    bool BoundOnly = false)
{
    /// <summary>False when the solver found no plan at all (its <see cref="Plan"/> is then empty and must never be chosen).</summary>
    public bool HasPlan { get; init; } = !BoundOnly;

    /// <summary>The result of a solver that does not apply to the instance: no plan, the reason as its note.</summary>
    public static SolverResult Declined(string solver, string reason, bool boundOnly = false) =>
        new(solver, Plan.Empty, 0, 0, [], SolverStatus.Declined, null, [reason], boundOnly) { HasPlan = false };
}
