namespace Anneal.Experiments;

/// <summary>One run of one solver on one instance with one seed and budget: a row of results.csv.</summary>
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
    string TraceFile);
