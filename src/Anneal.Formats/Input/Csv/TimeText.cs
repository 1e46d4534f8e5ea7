using System.Globalization;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// Times of day and durations as the CSV job writes them: <c>HH:MM</c>, <c>H:MM</c> or plain minutes; a trailing
/// <c>:SS</c> (as spreadsheets export time cells, e.g. 08:00:00) is accepted too.
/// </summary>
public static class TimeText
{
    /// <summary>Largest hour of a time of day: two days cover night shifts that end the next morning.</summary>
    public const int MaxHour = 47;

    /// <summary>A time of day in minutes since midnight: <c>HH:MM</c> (HH 0–47, MM 00–59) or minutes from 0 to 2880.</summary>
    public static bool TryParseTime(string text, out double minutes) =>
        TryParse(text, MaxHour, out minutes) && Limits.TimeOfDay.Contains(minutes);

    /// <summary>A duration in minutes: <c>H:MM</c> (any hours, MM 00–59) or non-negative minutes.</summary>
    public static bool TryParseDuration(string text, out double minutes) => TryParse(text, int.MaxValue, out minutes);

    private static bool TryParse(string text, int maxHour, out double minutes)
    {
        minutes = 0;
        var s = text.Trim();
        int colon = s.IndexOf(':', StringComparison.Ordinal);
        if (colon < 0)
        {
            return double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out minutes)
                && double.IsFinite(minutes) && minutes >= 0;
        }

        var h = s.AsSpan(0, colon);
        var m = s.AsSpan(colon + 1);
        int secs = 0;
        if (m.Length == 5 && m[2] == ':')
        {
            var sec = m[3..];
            if (!AllDigits(sec) || (secs = int.Parse(sec, NumberStyles.None, CultureInfo.InvariantCulture)) > 59)
            {
                return false;
            }

            m = m[..2];
        }

        if (h.Length == 0 || m.Length != 2 || !AllDigits(h) || !AllDigits(m))
        {
            return false;
        }

        if (!int.TryParse(h, NumberStyles.None, CultureInfo.InvariantCulture, out int hours) || hours > maxHour)
        {
            return false;
        }

        int mins = int.Parse(m, NumberStyles.None, CultureInfo.InvariantCulture);
        if (mins > 59)
        {
            return false;
        }

        minutes = (hours * 60.0) + mins + (secs / 60.0);
        return true;
    }

    private static bool AllDigits(ReadOnlySpan<char> span)
    {
        foreach (char c in span)
        {
            if (c is < '0' or > '9')
            {
                return false;
            }
        }

        return true;
    }
}
