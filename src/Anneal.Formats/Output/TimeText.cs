using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Formats.Output;

/// <summary>Times as people read them: HH:MM for minute-based jobs (26:15 is the next morning), plain numbers otherwise.</summary>
public static class TimeText
{
    public static string Clock(Instance instance, double value)
    {
        if (!double.IsFinite(value))
        {
            return string.Empty;
        }

        if (instance.TimeUnit != "min")
        {
            return Number(value);
        }

        long minutes = (long)Math.Round(value, MidpointRounding.AwayFromZero);
        string sign = minutes < 0 ? "-" : string.Empty;
        minutes = Math.Abs(minutes);
        return string.Create(CultureInfo.InvariantCulture, $"{sign}{minutes / 60:00}:{minutes % 60:00}");
    }

    /// <summary>A window as open-close; empty ends stay empty (an always-open window reads "any").</summary>
    public static string Window(Instance instance, TimeWindow window) =>
        !double.IsFinite(window.Open) && !double.IsFinite(window.Close)
            ? "any"
            : $"{Clock(instance, window.Open)}-{Clock(instance, window.Close)}";

    public static string Number(double value) => value.ToString("0.00", CultureInfo.InvariantCulture);

    /// <summary>Quantities (loads, demands) without needless decimals.</summary>
    public static string Amount(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
