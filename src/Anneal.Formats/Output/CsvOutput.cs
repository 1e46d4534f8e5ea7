using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Formats.Output;

/// <summary>The CSV dialect of every output file: invariant culture, comma, RFC 4180 quoting, LF line ends.</summary>
internal static class CsvOutput
{
    private static readonly CsvConfiguration Configuration = new(CultureInfo.InvariantCulture) { NewLine = "\n" };

    public static CsvWriter Open(TextWriter writer) => new(writer, Configuration, leaveOpen: true);
}
