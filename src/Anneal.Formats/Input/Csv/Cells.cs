using System.Globalization;

namespace Anneal.Formats.Input.Csv;

/// <summary>Typed access to one row's cells; every malformed value becomes a problem on its row and column.</summary>
internal readonly struct Cells(CsvTable table, CsvRow row, ProblemList problems)
{
    public int Line => row.Line;

    public string File => table.File;

    public ProblemList Problems => problems;

    public JobNames Names => table.Names;

    /// <summary>The trimmed cell text, or "" when the column or the cell is absent.</summary>
    public string Text(string column)
    {
        int i = table.IndexOf(column);
        return i >= 0 && i < row.Cells.Length ? row.Cells[i].Trim() : string.Empty;
    }

    public bool Has(string column) => table.Has(column);

    /// <summary>The header name as written, for messages.</summary>
    public string Name(string column)
    {
        int i = table.IndexOf(column);
        return i >= 0 ? table.Header[i] : column;
    }

    public string? Required(string column, string meaning)
    {
        if (!table.Has(column))
        {
            return null; // the missing column is reported once, on the header
        }

        var text = Text(column);
        if (text.Length == 0)
        {
            Report(column, text, $"'{Name(column)}' is empty", $"give {meaning}");
            return null;
        }

        return text;
    }

    public void Report(string column, string? value, string problem, string fix) =>
        problems.Add(table, row.Line, Name(column), value, problem, fix);

    /// <summary>A finite number; <paramref name="fallback"/> when empty (NaN fallback makes it required).</summary>
    public double Number(string column, double fallback, bool nonNegative, string meaning)
    {
        var text = Text(column);
        if (text.Length == 0)
        {
            if (double.IsNaN(fallback) && table.Has(column))
            {
                Report(column, text, $"'{Name(column)}' is empty", $"give {meaning}");
            }

            return fallback;
        }

        if (!double.TryParse(Decimal(text), NumberStyles.Float, CultureInfo.InvariantCulture, out double value) || !double.IsFinite(value))
        {
            Report(column, text, "not a number", table.Dialect.DecimalComma
                ? $"write {meaning} as a plain number, e.g. 12,5 or 12.5, without thousands separators"
                : $"write {meaning} as a plain number with a dot for decimals, e.g. 12.5");
            return fallback;
        }

        if (nonNegative && value < 0)
        {
            Report(column, text, "negative value", $"give {meaning} as zero or more");
            return fallback;
        }

        return value;
    }

    /// <summary>
    /// The text with its decimal comma turned into a point when the file's dialect has decimal commas ("12,5" is 12.5);
    /// a text with both a comma and a point is left alone, so that "1.234,5" fails rather than being guessed.
    /// </summary>
    public string Decimal(string text)
    {
        if (!table.Dialect.DecimalComma)
        {
            return text;
        }

        int comma = text.IndexOf(',', StringComparison.Ordinal);
        if (comma < 0 || text.IndexOf(',', comma + 1) >= 0 || text.Contains('.', StringComparison.Ordinal) || text.Contains(':', StringComparison.Ordinal))
        {
            return text;
        }

        table.DecimalCommasRead++;
        return string.Concat(text.AsSpan(0, comma), ".", text.AsSpan(comma + 1));
    }

    /// <summary>A number within <paramref name="range"/> (see <see cref="Limits"/>); <paramref name="fallback"/> when empty or out of range.</summary>
    public double Number(string column, double fallback, NumberRange range, string meaning)
    {
        if (Text(column).Length == 0)
        {
            return Number(column, fallback, false, meaning); // reports an empty required cell
        }

        double value = Number(column, double.NaN, range.Min >= 0, meaning);
        if (double.IsNaN(value))
        {
            return fallback;
        }

        return InRange(column, value, range, meaning) ? value : fallback;
    }

    /// <summary>Reports <paramref name="value"/> when it lies outside <paramref name="range"/>.</summary>
    public bool InRange(string column, double value, NumberRange range, string meaning)
    {
        if (range.Contains(value))
        {
            return true;
        }

        Report(column, Text(column), Limits.Problem(range), Limits.Fix(range, meaning));
        return false;
    }

    /// <summary>A duration within <paramref name="range"/>; <paramref name="fallback"/> when empty, malformed or out of range.</summary>
    public double Duration(string column, double fallback, NumberRange range, string meaning)
    {
        double value = Duration(column, double.NaN);
        if (double.IsNaN(value))
        {
            return fallback;
        }

        return InRange(column, value, range, meaning) ? value : fallback;
    }

    public double Time(string column, double fallback) => Clock(column, fallback, TimeText.TryParseTime, "not a valid time",
        "write HH:MM with HH from 0 to 47 and MM from 00 to 59 (e.g. 07:30), or minutes since midnight from 0 to 2880 (the job's day and the next)");

    public double Duration(string column, double fallback) => Clock(column, fallback, TimeText.TryParseDuration, "not a valid duration",
        "write H:MM with MM from 00 to 59 (e.g. 0:15), or a number of minutes");

    private delegate bool ClockParser(string text, out double minutes);

    private double Clock(string column, double fallback, ClockParser parse, string problem, string fix)
    {
        var text = Text(column);
        if (text.Length == 0)
        {
            return fallback;
        }

        if (!parse(Decimal(text), out double t))
        {
            Report(column, text, problem, fix);
            return fallback;
        }

        return t;
    }

    public bool Flag(string column)
    {
        var text = Text(column);
        switch (text.ToLowerInvariant())
        {
            case "": case "no": case "false": case "0": return false;
            case "yes": case "true": case "1": return true;
            default:
                Report(column, text, "not yes or no", "write yes, no, true, false, 1 or 0");
                return false;
        }
    }

    /// <summary>Names separated by ';', trimmed, empty pieces skipped.</summary>
    public List<string> List(string column)
    {
        var result = new List<string>();
        foreach (var piece in Text(column).Split(';'))
        {
            var p = piece.Trim();
            if (p.Length > 0)
            {
                result.Add(p);
            }
        }

        return result;
    }
}
