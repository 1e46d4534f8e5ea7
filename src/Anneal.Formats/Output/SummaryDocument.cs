namespace Anneal.Formats.Output;

// The shape of summary.json. Field names are the README's contract; serialised in camelCase.

/// <summary>The whole summary.json.</summary>
/// <param name="LowerBound">The strongest lower bound any solver proved on the objective of plans that keep the hard rules; null when none did.</param>
/// <param name="Notes">What the run says as a whole (solvers left out of the defaults, a solver's expected memory, budget kept for writing).</param>
public sealed record SummaryDocument(
    string Instance,
    string Format,
    string ObjectiveKind,
    PlanSummary Plan,
    IReadOnlyList<ObstacleSummary> Screening,
    IReadOnlyList<SolverSummary> Solvers,
    string? Chosen,
    int? Seed,
    double? TimeLimitSeconds,
    bool Interrupted,
    IReadOnlyList<string> Cautions,
    DateTimeOffset GeneratedAt,
    double? LowerBound = null,
    IReadOnlyList<string>? Notes = null,
    ChangesSummary? Changes = null)
{
    /// <summary>The version of Anneal that wrote the file.</summary>
    public string AnnealVersion { get; init; } = ToolVersion.Version;

    /// <summary>The commit that version was built from ("unknown" without git at build time).</summary>
    public string Commit { get; init; } = ToolVersion.Commit;
}

/// <summary>The written plan as the evaluator judged it.</summary>
public sealed record PlanSummary(
    double Objective,
    double Distance,
    double Duration,
    int Vehicles,
    bool Feasible,
    IReadOnlyList<string> Unserved,
    BreakdownSummary Breakdown,
    IReadOnlyList<ViolationSummary> Violations,
    IReadOnlyList<StopSummary> UnservedStops)
{
    /// <summary>Per route of a vehicle with driving rules: its driving, breaks and duty span (empty when no vehicle has rules).</summary>
    public IReadOnlyList<RouteDrivingSummary> Driving { get; init; } = [];
}

/// <summary>
/// One route's drivers' hours: the rule set with its source, minutes of driving, of breaks (waits that count included)
/// and of duty span (depot to depot), the number of breaks, and the minutes over each rule (<c>driving-time</c>, <c>duty-span</c>).
/// </summary>
public sealed record RouteDrivingSummary(
    string Vehicle,
    string RuleSet,
    string Source,
    bool Hard,
    double DrivingMinutes,
    double BreakMinutes,
    int Breaks,
    double DutySpanMinutes,
    IReadOnlyDictionary<string, double> Breaches);

/// <summary>A stop as the input names it, for people: id, name and address (empty when the input gives none).</summary>
public sealed record StopSummary(string Id, string Name, string Address);

public sealed record BreakdownSummary(
    double Fixed,
    double Distance,
    double Time,
    double Vehicles,
    double Lateness,
    double Overload,
    double Overtime,
    double DurationExcess,
    double Unserved,
    double Total,
    double Stability = 0,
    double DrivingOver = 0);

/// <summary>What a re-plan changed against its given plan (summary.json's `changes`; changes.csv lists each stop).</summary>
/// <param name="Now">`--now` as a clock time; null for a warm start.</param>
public sealed record ChangesSummary(string? Now, IReadOnlyList<string> Without, int Fixed, int Added, int Cancelled, int Moved, int Retimed, string Summary);

public sealed record ViolationSummary(string Rule, bool Hard, string? Vehicle, string? Stop, double Amount, string Message);

/// <summary>What the input screening found no plan can do, and why (the stop is null for the whole day).</summary>
public sealed record ObstacleSummary(string Rule, string? Stop, string Message);

/// <summary>One solver's run, judged by the evaluator (not by the solver's own numbers); objective, distance and vehicles are null when it found no plan.</summary>
/// <param name="BoundOnly">The solver proves a bound and offers no plan.</param>
public sealed record SolverSummary(
    string Solver,
    double? Objective,
    double? Distance,
    int? Vehicles,
    bool Feasible,
    double SecondsToBest,
    double Seconds,
    string Status,
    double? LowerBound,
    IReadOnlyList<string> Notes,
    bool BoundOnly = false);
