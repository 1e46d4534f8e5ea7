namespace Anneal.Experiments;

/// <summary>One run of one solver on one instance with one seed and budget: a row of results.csv.</summary>
/// <param name="LowerBound">The lower bound the solver proved on the objective, when it proved one.</param>
/// <param name="BoundOnly">The solver proves bounds and offers no plan (its plan columns describe an empty plan).</param>
public sealed record BenchRow(
    string Instance,
    string Solver,
    int Seed,
    double BudgetSeconds,
    string Objective,
    double ObjectiveValue,
    int Vehicles,
    double Distance,
    bool Feasible,
    double SecondsToBest,
    double Seconds,
    double? Reference,
    int? ReferenceVehicles,
    double? GapPercent,
    string TraceFile,
    double? LowerBound = null,
    bool BoundOnly = false);
