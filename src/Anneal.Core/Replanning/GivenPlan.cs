namespace Anneal.Core.Replanning;

/// <summary>What a row of a given plan says has happened to a visit (the optional `status` column).</summary>
public enum VisitStatus
{
    Planned,
    InProgress,
    Done,
}

/// <summary>
/// One visit of a given plan as its file has it. <see cref="Stop"/> indexes the job's stops; -1 when the job no
/// longer has the stop (it was cancelled). Times are the file's; null where it gives none (a row added by hand).
/// </summary>
public sealed record GivenVisit(int Row, string StopId, int Stop, double? Start, double? Departure, VisitStatus? Status, bool Pinned);

/// <summary>One vehicle's visits in the order of the file's rows, with its depot departure and return when given.</summary>
public sealed record GivenRoute(int Vehicle, IReadOnlyList<GivenVisit> Visits, double? DepotDeparture, double? Return);

/// <summary>A plan from an earlier run (possibly edited by hand), on the job's stop and vehicle indices.</summary>
public sealed record GivenPlan(string File, IReadOnlyList<GivenRoute> Routes);
