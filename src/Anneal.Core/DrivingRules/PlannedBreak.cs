namespace Anneal.Core.DrivingRules;

/// <summary>Where a break is taken.</summary>
public enum BreakPlace
{
    /// <summary>On the road: the leg to the stop is split in two.</summary>
    Road,

    /// <summary>At the stop, on arrival, before service (a wait for the window is part of it).</summary>
    BeforeService,

    /// <summary>At the stop, after service.</summary>
    AfterService,

    /// <summary>The wait for the stop's window, long enough to count.</summary>
    Waiting,
}

/// <summary>
/// One break of a scheduled route. <see cref="Position"/> is the index of the stop it belongs to (the stop whose leg it
/// splits, or at which it is taken); the route's length stands for the leg home. <see cref="Drive"/> is the driving
/// since the row before (the stop or break before it), as routes.csv writes it.
/// </summary>
public readonly record struct PlannedBreak(double Start, double End, int Position, BreakPlace Place, double Drive, bool FirstPart)
{
    public double Minutes => End - Start;
}
