namespace Anneal.Core.Evaluation;

/// <summary>When a vehicle is at a stop. <see cref="Late"/> is minutes late (soft windows) or time warp (hard windows).</summary>
public struct VisitTimes
{
    public double Arrival;
    public double Wait;
    public double Start;
    public double Departure;
    public double Late;

    /// <summary>Driving since the row before (the stop or a break before it), as routes.csv's <c>drive</c> column holds it.</summary>
    public double Drive;
}
