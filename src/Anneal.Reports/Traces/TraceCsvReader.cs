using System.Globalization;
using Anneal.Core.Solving;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Reports.Traces;

/// <summary>Reads trace.csv (as TraceCsvWriter writes it) back into each solver's trace points, in file order.</summary>
public static class TraceCsvReader
{
    private static readonly CsvConfiguration Configuration = new(CultureInfo.InvariantCulture) { HasHeaderRecord = true };

    /// <exception cref="InvalidDataException">when a row cannot be read.</exception>
    public static IReadOnlyDictionary<string, IReadOnlyList<TracePoint>> Read(string path)
    {
        using var reader = new StreamReader(path);
        return Read(reader, path);
    }

    public static IReadOnlyDictionary<string, IReadOnlyList<TracePoint>> Read(TextReader text, string name)
    {
        var traces = new Dictionary<string, List<TracePoint>>(StringComparer.Ordinal);
        using var csv = new CsvReader(text, Configuration);
        if (!csv.Read() || !csv.ReadHeader())
        {
            return new Dictionary<string, IReadOnlyList<TracePoint>>();
        }

        while (csv.Read())
        {
            string solver = csv.GetField("solver") ?? string.Empty;
            var point = new TracePoint(
                Number(csv, "seconds", name),
                long.Parse(csv.GetField("iteration") ?? "0", CultureInfo.InvariantCulture),
                Number(csv, "best_objective", name),
                Number(csv, "current_objective", name),
                csv.GetField("best_feasible") == "true",
                csv.GetField("state") ?? string.Empty);
            if (!traces.TryGetValue(solver, out var list))
            {
                traces[solver] = list = [];
            }

            list.Add(point);
        }

        var result = new Dictionary<string, IReadOnlyList<TracePoint>>(StringComparer.Ordinal);
        foreach (var (solver, list) in traces)
        {
            result[solver] = list;
        }

        return result;
    }

    // The writer leaves non-finite objectives empty.
    private static double Number(CsvReader csv, string column, string name)
    {
        string? text = csv.GetField(column);
        if (string.IsNullOrEmpty(text))
        {
            return double.NaN;
        }

        return double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double x)
            ? x
            : throw new InvalidDataException($"{name}: row {csv.Parser.Row}: '{text}' in column {column} is not a number");
    }
}
