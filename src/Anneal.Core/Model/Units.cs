using System.Globalization;

namespace Anneal.Core.Model;

/// <summary>
/// How an instance measures time and distance, and how its times read. CSV jobs count minutes of the day and
/// kilometres (<see cref="Minutes"/>); benchmark files have unitless numbers (<see cref="Plain"/>).
/// </summary>
/// <param name="Time">Label of the time unit ("min"), empty when it has none.</param>
/// <param name="TimePerHour">Time units in one hour; converts a per-hour cost.</param>
/// <param name="Distance">Label of the distance unit ("km"), empty when it has none.</param>
/// <param name="Clock">Times are minutes of the day, read as HH:MM (26:15 is 02:15 the next day).</param>
public sealed record Units(string Time, double TimePerHour, string Distance, bool Clock)
{
    public static Units Minutes { get; } = new("min", 60, "km", true);

    public static Units Plain { get; } = new(string.Empty, 60, string.Empty, false);

    /// <summary>The time unit in words, plural: "min" or "time units".</summary>
    public string TimeWords => Time.Length > 0 ? Time : "time units";

    /// <summary>The time unit in words, singular: "min" or "time unit".</summary>
    public string TimeWord => Time.Length > 0 ? Time : "time unit";

    /// <summary>" km" after a distance, or nothing.</summary>
    public string DistanceSuffix => Distance.Length > 0 ? " " + Distance : string.Empty;

    /// <summary>" min" after a duration, or nothing.</summary>
    public string TimeSuffix => Time.Length > 0 ? " " + Time : string.Empty;

    /// <summary>
    /// The one reading of a time: HH:MM on a clock (rounded to the minute), else the number with two decimals;
    /// empty for a time that is not finite.
    /// </summary>
    public string Format(double time)
    {
        if (!double.IsFinite(time))
        {
            return string.Empty;
        }

        if (!Clock)
        {
            return time.ToString("0.00", CultureInfo.InvariantCulture);
        }

        long minutes = (long)Math.Round(time, MidpointRounding.AwayFromZero);
        string sign = minutes < 0 ? "-" : string.Empty;
        minutes = Math.Abs(minutes);
        return string.Create(CultureInfo.InvariantCulture, $"{sign}{minutes / 60:00}:{minutes % 60:00}");
    }
}
