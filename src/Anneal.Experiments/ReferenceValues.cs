using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Travel;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Experiments;

/// <summary>One best-known or optimal value (a row of a reference CSV in the format of bks.csv).</summary>
public sealed record ReferenceValue(string Instance, string Objective, int? Vehicles, double Value, string DistanceRule, string Source);

/// <summary>
/// Best-known values by instance and objective. Matching follows the benchmark conventions: `distance` compares with
/// `distance-only` rows under the instance's own distance rule; `vehicles-then-distance` with `vehicles-first` rows.
/// </summary>
public sealed class ReferenceValues
{
    private readonly List<ReferenceValue> _rows;

    public ReferenceValues(IEnumerable<ReferenceValue> rows)
    {
        _rows = rows.ToList();
    }

    public static ReferenceValues Empty { get; } = new([]);

    public int Count => _rows.Count;

    /// <exception cref="Formats.Input.InputException">when the file is missing or malformed.</exception>
    public static ReferenceValues Read(string path)
    {
        var problems = new List<Formats.Input.InputProblem>();
        var rows = new List<ReferenceValue>();
        try
        {
            using var reader = new StreamReader(path);
            using var csv = new CsvReader(reader, new CsvConfiguration(CultureInfo.InvariantCulture) { PrepareHeaderForMatch = a => a.Header.Trim().ToLowerInvariant() });
            csv.Read();
            csv.ReadHeader();
            foreach (var needed in new[] { "instance", "objective", "value" })
            {
                if (!csv.HeaderRecord!.Contains(needed, StringComparer.OrdinalIgnoreCase))
                {
                    problems.Add(new(path, 1, needed, null, "a required column is missing", "give columns instance, objective, value (and optionally vehicles, distance_rule, value_source) as in bks.csv"));
                }
            }

            if (problems.Count > 0)
            {
                throw new Formats.Input.InputException(problems);
            }

            while (csv.Read())
            {
                int row = csv.Parser.Row;
                string text = csv.GetField("value") ?? string.Empty;
                if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value))
                {
                    problems.Add(new(path, row, "value", text, "not a number", "write the reference value as a plain number"));
                    continue;
                }

                int? vehicles = int.TryParse(Field(csv, "vehicles"), NumberStyles.Integer, CultureInfo.InvariantCulture, out int v) ? v : null;
                rows.Add(new ReferenceValue(csv.GetField("instance") ?? string.Empty, csv.GetField("objective") ?? string.Empty, vehicles, value,
                    Field(csv, "distance_rule"), Field(csv, "value_source")));
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or CsvHelperException)
        {
            throw new Formats.Input.InputException(new Formats.Input.InputProblem(path, null, null, null, "the reference file cannot be read: " + e.Message, "give a CSV like ../shared/benchmarks/bks.csv"));
        }

        if (problems.Count > 0)
        {
            throw new Formats.Input.InputException(problems);
        }

        return new ReferenceValues(rows);
    }

    private static string Field(CsvReader csv, string name) =>
        csv.HeaderRecord!.Contains(name, StringComparer.OrdinalIgnoreCase) ? csv.GetField(name) ?? string.Empty : string.Empty;

    /// <summary>The reference for this instance under its objective and distance rule, or null.</summary>
    public ReferenceValue? Find(Instance instance)
    {
        string objective = instance.Objective switch
        {
            Objective.VehiclesThenDistance => "vehicles-first",
            Objective.Distance => "distance-only",
            _ => "cost",
        };
        string rule = instance.Travel.Rule switch
        {
            DistanceRule.Euclidean => "euclidean-double",
            DistanceRule.EuclideanRounded => "euclidean-rounded",
            _ => string.Empty,
        };
        ReferenceValue? loose = null;
        foreach (var r in _rows)
        {
            if (!string.Equals(r.Instance, instance.Name, StringComparison.OrdinalIgnoreCase) || !string.Equals(r.Objective, objective, StringComparison.OrdinalIgnoreCase))
            {
                continue;
            }

            if (rule.Length > 0 && r.DistanceRule.StartsWith(rule, StringComparison.OrdinalIgnoreCase))
            {
                return r;
            }

            loose ??= r.DistanceRule.Length == 0 ? r : null;
        }

        return loose;
    }
}
