using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Formats.Output;

/// <summary>
/// The CSV dialect of every output file, the run files and the bench's alike: invariant culture, comma, RFC 4180
/// quoting (a field with a comma, a quote, CR or LF is quoted), LF line ends.
/// </summary>
public static class CsvOutput
{
    private static readonly CsvConfiguration Configuration = new(CultureInfo.InvariantCulture) { NewLine = "\n" };

    public static CsvWriter Open(TextWriter writer) => new(writer, Configuration, leaveOpen: true);

    /// <summary>Writes one record of fields already formatted as text.</summary>
    public static void Row(CsvWriter csv, params ReadOnlySpan<string> fields)
    {
        foreach (string field in fields)
        {
            csv.WriteField(field);
        }

        csv.NextRecord();
    }
}
