using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Core.Replanning;

/// <summary>
/// What stays of a vehicle's given route: the visits fixed by `now` (served, in service, or being driven to),
/// and where and when the vehicle continues (a location of the job's instance, a time). A vehicle taken out
/// keeps only the visits it served and continues nowhere.
/// </summary>
public sealed record FixedPart(int Vehicle, IReadOnlyList<GivenVisit> Visits, int ContinueLocation, double ContinueAt, bool TakenOut);

/// <summary>
/// A started day reduced to what is left to plan. <see cref="Instance"/> holds the stops not yet fixed and the
/// vehicles still out, each starting where and when it continues, with its capacity for the rest of its route and its fixed cost
/// already paid when it has started; every solver plans it as any other instance. <see cref="Start"/> is the given
/// plan's unstarted part on it, with new stops and those of vehicles taken out unserved (the search repairs it).
/// </summary>
public sealed record ResidualDay(
    Instance Day,
    Instance Instance,
    Plan Start,
    int[] DayStop,
    int[] DayVehicle,
    IReadOnlyList<FixedPart> Fixed,
    IReadOnlyList<GivenVisit> Cancelled,
    IReadOnlyList<int> NewStops,
    IReadOnlyList<string> Notes,
    ReplanRequest Request)
{
    /// <summary>The residual index of a job's vehicle; -1 when it was taken out.</summary>
    public int ResidualVehicle(int dayVehicle) => Array.IndexOf(DayVehicle, dayVehicle);

    /// <summary>The residual index of a job's stop; -1 when it is fixed.</summary>
    public int ResidualStop(int dayStop) => Array.IndexOf(DayStop, dayStop);
}
