namespace Anneal.Core.Model;

/// <summary>An interval in which service may start. Times share the instance's time unit (minutes for CSV jobs).</summary>
public readonly record struct TimeWindow(double Open, double Close)
{
    public static readonly TimeWindow Always = new(double.NegativeInfinity, double.PositiveInfinity);
}
