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
}
