using Anneal.Core.Solving;

namespace Anneal.Reports.Traces;

/// <summary>One solver's part in a run, as the pictures and the report need it: the judged result and its convergence.</summary>
/// <param name="Objective">The evaluator's objective of the solver's final plan; null (as vehicles and distance) when it found none.</param>
/// <param name="BoundOnly">The solver proves a bound and offers no plan; its trace is the bound rising.</param>
public sealed record SolverRun(
    string Solver,
    double? Objective,
    bool Feasible,
    int? Vehicles,
    double? Distance,
    double Seconds,
    double SecondsToBest,
    string Status,
    double? LowerBound,
    IReadOnlyList<string> Notes,
    IReadOnlyList<TracePoint> Trace,
    bool BoundOnly = false)
{
    public bool HasPlan => Objective is not null;
}
