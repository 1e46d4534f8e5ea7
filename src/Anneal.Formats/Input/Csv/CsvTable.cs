using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// A CSV file read into a header and rows, each row knowing its physical line. The separator (',', ';' or tab) is
/// found from the header line. Quoting faults found by CsvHelper become problems on the line where the record
/// starts; they never escape as exceptions.
/// </summary>
internal sealed record CsvTable
{
    public required string File { get; init; }

    public CsvDialect Dialect { get; init; } = CsvDialect.Comma;

    /// <summary>The text encoding when it was not UTF-8 (e.g. "Windows-1252"); null for UTF-8.</summary>
    public string? Encoding { get; init; }

    /// <summary>The workbook sheet this table was read from; null for a CSV file.</summary>
    public string? Sheet { get; init; }

    /// <summary>What the job's parts are called in messages that point from one to another.</summary>
    public JobNames Names { get; init; } = JobNames.Csv;

    /// <summary>Numbers read with a decimal comma, so that `check` can say the file used them.</summary>
    public int DecimalCommasRead { get; set; }

    /// <summary>Header names as written (trimmed); look-ups are case-insensitive.</summary>
    public required IReadOnlyList<string> Header { get; init; }

    public required IReadOnlyList<CsvRow> Rows { get; init; }

    public int IndexOf(string column)
    {
        for (int i = 0; i < Header.Count; i++)
        {
            if (string.Equals(Header[i], column, StringComparison.OrdinalIgnoreCase))
            {
                return i;
            }
        }

        return -1;
    }

    public bool Has(string column) => IndexOf(column) >= 0;

    /// <summary>The spreadsheet name of a cell ("D4"), for tables read from a workbook; null otherwise.</summary>
    public string? CellName(int? row, string? column)
    {
        int index = column is null ? -1 : IndexOf(column);
        if (Sheet is null || row is null || index < 0)
        {
            return null;
        }

        var letters = string.Empty;
        for (int n = index + 1; n > 0; n = (n - 1) / 26)
        {
            letters = (char)('A' + ((n - 1) % 26)) + letters;
        }

        return letters + row.Value.ToString(CultureInfo.InvariantCulture);
    }

    /// <summary>Parses <paramref name="text"/>; returns null when the file has no header at all.</summary>
    public static CsvTable? Parse(string text, string file, ProblemList problems)
    {
        var records = new List<CsvRow>();
        int line = 1;
        int recordStart = 1;
        var dialect = CsvDialect.Detect(text);
        var config = new CsvConfiguration(CultureInfo.InvariantCulture)
        {
            IgnoreBlankLines = false,
            DetectDelimiter = false,
            Delimiter = dialect.Delimiter.ToString(),
            BadDataFound = args => problems.Add(file, recordStart, null, Shorten(args.Field),
                "badly placed double quote (a quoted field must be quoted from its first to its last character, and every quote inside it doubled)",
                "quote the whole field and write each \" inside it as \"\""),
        };
        try
        {
            using var parser = new CsvParser(new StringReader(text), config);
            while (true)
            {
                recordStart = line;
                if (!parser.Read())
                {
                    break;
                }

                string raw = parser.RawRecord;
                line += LineBreaks(raw);
                var cells = parser.Record ?? [];
                if (cells.Length == 1 && string.IsNullOrWhiteSpace(cells[0]))
                {
                    continue;
                }

                records.Add(new CsvRow(recordStart, cells));
            }
        }
        catch (CsvHelperException e)
        {
            problems.Add(file, recordStart, null, null, "the file cannot be read as CSV: " + FirstLine(e.Message), "check the quoting on this line");
        }

        if (records.Count == 0)
        {
            problems.Add(file, null, null, null, "the file is empty (no header line)", "write a header line with the column names, then one line per record");
            return null;
        }

        var header = new string[records[0].Cells.Length];
        for (int i = 0; i < header.Length; i++)
        {
            header[i] = records[0].Cells[i].Trim();
        }

        if (records[0].Line != 1)
        {
            problems.Add(file, records[0].Line, null, null, "blank lines before the header", "start the file with the header line");
        }

        var rows = records.GetRange(1, records.Count - 1);
        string separator = dialect.Delimiter switch { ';' => "semicolons", '\t' => "tabs", _ => "commas" };
        foreach (var row in rows)
        {
            if (row.Cells.Length != header.Length)
            {
                problems.Add(file, row.Line, null, null,
                    $"the line has {row.Cells.Length} fields but the header has {header.Length} ({dialect.Name}, as the header line is)",
                    $"give one value per header column (leave a value empty between {separator}) and quote values that contain {separator}");
            }
        }

        return new CsvTable { File = file, Header = header, Rows = rows, Dialect = dialect };
    }

    private static int LineBreaks(string raw)
    {
        int n = 0;
        for (int i = 0; i < raw.Length; i++)
        {
            if (raw[i] == '\n' || (raw[i] == '\r' && (i + 1 == raw.Length || raw[i + 1] != '\n')))
            {
                n++;
            }
        }

        return n;
    }

    private static string FirstLine(string message)
    {
        int nl = message.IndexOfAny(['\r', '\n']);
        return nl < 0 ? message : message[..nl];
    }

    internal static string Shorten(string text)
    {
        var t = text.TrimEnd('\r', '\n');
        return t.Length <= 60 ? t : t[..57] + "...";
    }
}
