using System.Globalization;

namespace Anneal.Formats.Input;

/// <summary>An accepted range of one kind of number, with its unit for messages.</summary>
/// <param name="MinExclusive">True when the minimum itself is refused (a speed or a budget must be above zero).</param>
public sealed record NumberRange(double Min, double Max, string Unit, bool MinExclusive = false)
{
    public bool Contains(double value) =>
        double.IsFinite(value) && (MinExclusive ? value > Min : value >= Min) && value <= Max;

    /// <summary>"from 0 to 1,440 minutes", "above 0 and at most 300 km/h".</summary>
    public string Describe()
    {
        string unit = Unit.Length == 0 ? string.Empty : " " + Unit;
        return MinExclusive
            ? $"above {Shown(Min)} and at most {Shown(Max)}{unit}"
            : $"from {Shown(Min)} to {Shown(Max)}{unit}";
    }

    private static string Shown(double v) =>
        Math.Abs(v) >= 1e7 ? v.ToString("0.###E+0", CultureInfo.InvariantCulture) : v.ToString("#,0.###", CultureInfo.InvariantCulture);
}

/// <summary>
/// The accepted range of every number Anneal reads (the README's "Accepted ranges" lists them). The ranges keep every
/// computed time, load and cost finite and far from the integer limits of the OR-Tools and CP-SAT models, and they are
/// wide enough for any real delivery day: a value outside them is a typo or a unit mix-up, refused with the usual
/// message (file, row, column, value, fix) rather than carried into a plan.
/// </summary>
public static class Limits
{
    /// <summary>Planar x and y (CSV jobs): half the Earth's circumference either side of the origin.</summary>
    public static readonly NumberRange PlanarKm = new(-20_000, 20_000, "km");

    /// <summary>A time of day in minutes since midnight: the job's day and the next (00:00 to 48:00).</summary>
    public static readonly NumberRange TimeOfDay = new(0, 48 * 60, "minutes");

    /// <summary>A stop's service time: at most one day.</summary>
    public static readonly NumberRange Service = new(0, 24 * 60, "minutes");

    /// <summary>A vehicle's maximum route duration: at most the two days a job covers.</summary>
    public static readonly NumberRange MaxDuration = new(0, 48 * 60, "minutes");

    /// <summary>One trip's duration in matrix.csv: at most the two days a job covers.</summary>
    public static readonly NumberRange TripMinutes = new(0, 48 * 60, "minutes");

    /// <summary>One trip's distance in matrix.csv: at most once around the Earth.</summary>
    public static readonly NumberRange TripKm = new(0, 40_000, "km");

    /// <summary>A demand or a capacity, in any dimension.</summary>
    public static readonly NumberRange Quantity = new(0, 1e9, "units");

    /// <summary>Every price: fixed cost, cost per km, cost per hour, a stop's penalty, a soft rule's price.</summary>
    public static readonly NumberRange Price = new(0, 1e6, string.Empty);

    /// <summary>settings.json travel.speedKmh.</summary>
    public static readonly NumberRange SpeedKmh = new(0, 300, "km/h", MinExclusive: true);

    /// <summary>settings.json travel.detourFactor: a road is no shorter than the straight line.</summary>
    public static readonly NumberRange DetourFactor = new(1, 10, string.Empty);

    /// <summary>settings.json timeSeconds: up to a week.</summary>
    public static readonly NumberRange TimeSeconds = new(0, 7 * 24 * 3600, "seconds", MinExclusive: true);

    /// <summary>Solomon and CVRPLIB coordinates (no unit).</summary>
    public static readonly NumberRange BenchmarkCoordinate = new(-1e7, 1e7, string.Empty);

    /// <summary>Solomon ready times, due dates and service times (no unit).</summary>
    public static readonly NumberRange BenchmarkTime = new(0, 1e7, string.Empty);

    /// <summary>Solomon and CVRPLIB demands and capacities.</summary>
    public static readonly NumberRange BenchmarkQuantity = new(0, 1e9, string.Empty);

    /// <summary>The fix for a value outside <paramref name="range"/>.</summary>
    public static string Fix(NumberRange range, string meaning) => $"give {meaning} {range.Describe()}";

    /// <summary>The problem text for a value outside <paramref name="range"/>.</summary>
    public static string Problem(NumberRange range) => "outside the accepted range (" + range.Describe() + ")";
}
