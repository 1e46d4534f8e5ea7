using System.Globalization;

namespace Anneal.Formats.Input.Workbook;

/// <summary>
/// A workbook cell as the text the job readers expect: numbers in invariant form, time cells (a fraction of a day)
/// as HH:MM, so that a cell typed as a number or a time is read as such whatever the spreadsheet's locale.
/// </summary>
internal static class CellText
{
    public static string Of(object? value) => value switch
    {
        null => string.Empty,
        string s => s,
        double d => Number(d),
        bool b => b ? "true" : "false",
        DateTime t => Clock(t),
        TimeSpan span => Clock(span.TotalMinutes),
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => value.ToString() ?? string.Empty,
    };

    private static string Number(double d) =>
        d == Math.Floor(d) && Math.Abs(d) < 1e15 ? d.ToString("0", CultureInfo.InvariantCulture) : d.ToString("R", CultureInfo.InvariantCulture);

    // The reader turns a time cell's serial number (days) into a date from its workbook's epoch: serial 0 shows as
    // 1899-12-31 (the 1900 system, with its leap-year quirk) or 1904-01-01 (the 1904 system).
    private static readonly DateTime Epoch1900 = new(1899, 12, 31);
    private static readonly DateTime Epoch1904 = new(1904, 1, 1);

    /// <summary>
    /// A time cell: a serial value under 2 days is a time of day or a duration (26:15 is 1.09375); a full date and
    /// time keeps only its clock time.
    /// </summary>
    private static string Clock(DateTime t)
    {
        foreach (var epoch in new[] { Epoch1900, Epoch1904 })
        {
            if (t >= epoch && t < epoch.AddDays(2))
            {
                return Clock((t - epoch).TotalMinutes);
            }
        }

        return Clock(t.TimeOfDay.TotalMinutes);
    }

    private static string Clock(double minutes)
    {
        long seconds = (long)Math.Round(minutes * 60);
        long h = seconds / 3600, m = seconds / 60 % 60, s = seconds % 60;
        return s == 0
            ? string.Create(CultureInfo.InvariantCulture, $"{h:00}:{m:00}")
            : string.Create(CultureInfo.InvariantCulture, $"{h:00}:{m:00}:{s:00}");
    }
}
