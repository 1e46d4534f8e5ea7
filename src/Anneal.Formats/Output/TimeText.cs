using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Formats.Output;

/// <summary>Times as people read them: HH:MM for minute-based jobs (26:15 is the next morning), plain numbers otherwise.</summary>
public static class TimeText
{
    /// <summary>A window as open-close; empty ends stay empty (an always-open window reads "any").</summary>
    public static string Window(Instance instance, TimeWindow window) =>
        !double.IsFinite(window.Open) && !double.IsFinite(window.Close)
            ? "any"
            : $"{instance.Units.Format(window.Open)}-{instance.Units.Format(window.Close)}";

    public static string Number(double value) => value.ToString("0.00", CultureInfo.InvariantCulture);

    /// <summary>Quantities (loads, demands) without needless decimals.</summary>
    public static string Amount(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
