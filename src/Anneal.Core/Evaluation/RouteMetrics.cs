namespace Anneal.Core.Evaluation;

/// <summary>
/// The measures of one route that its cost depends on. <see cref="TimeWindowViolation"/> is minutes late when
/// windows are soft and time warp (Nagata, Bräysy &amp; Dullaert 2010) when they are hard. Duration includes any
/// time warp, as in Vidal et al. (2013), so warping never looks cheaper than waiting.
/// </summary>
public struct RouteMetrics
{
    public int StopCount;
    public double Distance;
    public double Duration;
    public double Departure;
    public double Return;
    public double TimeWindowViolation;
    public double Overload;
    public double Overtime;
    public double DurationExcess;
    public int MissingEquipment;

    /// <summary>Stops whose collect-and-deliver pair this route breaks (see <see cref="RouteLoads.PairBreaks"/>); always a hard rule.</summary>
    public int PairBreaks;

    /// <summary>The day's driving; set only for a vehicle with driving rules (<see cref="DrivingRules.BreakScheduler"/>), else zero.</summary>
    public double Driving;

    /// <summary>Breaks planned into the route, waits that count as breaks included; zero without driving rules.</summary>
    public double BreakMinutes;

    /// <summary>Minutes over the day's driving and the duty span of hard driving rules (a hard breach).</summary>
    public double DrivingBreach;

    /// <summary>The same minutes over when the vehicle's driving rules are soft (priced per minute).</summary>
    public double DrivingOver;

    /// <summary>
    /// The stability price of the route's stops in a re-plan (<see cref="CostModel.StopStability"/> summed over the
    /// scheduled starts), so that every move is priced by it; zero when the instance prices no stability.
    /// </summary>
    public double Stability;
}
