using System.Globalization;

namespace Anneal.Core.Screening;

/// <summary>Times for messages: <c>HH:MM</c> when the instance counts minutes, plain numbers otherwise.</summary>
public static class TimeLabel
{
    public static string Format(double time, string timeUnit)
    {
        if (double.IsPositiveInfinity(time))
        {
            return "never";
        }

        if (timeUnit != "min")
        {
            return time.ToString("0.##", CultureInfo.InvariantCulture);
        }

        long total = (long)Math.Round(time, MidpointRounding.AwayFromZero);
        string sign = total < 0 ? "-" : string.Empty;
        total = Math.Abs(total);
        return string.Create(CultureInfo.InvariantCulture, $"{sign}{total / 60:00}:{total % 60:00}");
    }
}
