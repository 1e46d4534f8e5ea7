using System.Globalization;

namespace Anneal.Tests.Core.Evaluation;

/// <summary>One row of ../shared/benchmarks/bks.csv.</summary>
internal sealed record BestKnown(string Instance, string Set, string Objective, int Vehicles, double Value, string DistanceRule, string Source);

/// <summary>Reads bks.csv at test time (plain CSV with double-quoted fields), so expected values are never copied into tests.</summary>
internal static class BestKnownValues
{
    public static BestKnown Find(string instance, string objective, string distanceRulePrefix)
    {
        foreach (var line in File.ReadLines(BenchmarkData.File("bks.csv")).Skip(1))
        {
            var f = Fields(line);
            if (f.Count >= 8 && f[0] == instance && f[3] == objective && f[6].StartsWith(distanceRulePrefix, StringComparison.Ordinal))
            {
                return new BestKnown(f[0], f[1], f[3], int.Parse(f[4], CultureInfo.InvariantCulture),
                    double.Parse(f[5], CultureInfo.InvariantCulture), f[6], f[7]);
            }
        }

        throw new InvalidOperationException($"bks.csv has no row for {instance}, {objective}, {distanceRulePrefix}");
    }

    private static List<string> Fields(string line)
    {
        var fields = new List<string>();
        var current = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < line.Length; i++)
        {
            char c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    current.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    current.Append(c);
                }
            }
            else if (c == '"')
            {
                quoted = true;
            }
            else if (c == ',')
            {
                fields.Add(current.ToString());
                current.Clear();
            }
            else
            {
                current.Append(c);
            }
        }

        fields.Add(current.ToString());
        return fields;
    }
}
