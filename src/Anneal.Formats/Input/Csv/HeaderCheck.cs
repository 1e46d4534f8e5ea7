namespace Anneal.Formats.Input.Csv;

/// <summary>Header rules shared by every job file: known names, prefixed families, <c>note…</c> columns ignored.</summary>
internal static class HeaderCheck
{
    /// <param name="known">Exact column names the file accepts.</param>
    /// <param name="prefixes">Families such as <c>demand_</c>; a column is the prefix plus a non-empty name.</param>
    public static void Check(CsvTable table, IReadOnlyList<string> known, IReadOnlyList<string> prefixes, ProblemList problems)
    {
        var seen = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        for (int i = 0; i < table.Header.Count; i++)
        {
            var name = table.Header[i];
            if (name.Length == 0)
            {
                problems.Add(table, 1, null, name, $"column {i + 1} has no name", "name every column in the header, or remove the empty column");
                continue;
            }

            if (!seen.TryAdd(name, i))
            {
                problems.Add(table, 1, name, name, $"the column appears twice (columns {seen[name] + 1} and {i + 1})", "keep one of them");
                continue;
            }

            if (IsKnown(name, known, prefixes) || name.StartsWith("note", StringComparison.OrdinalIgnoreCase))
            {
                continue;
            }

            var suggestions = new List<string>(known);
            foreach (var p in prefixes)
            {
                suggestions.Add(p + "<name>");
            }

            var near = Closest.Find(name, Candidates(name, known, prefixes));
            var fix = near is not null
                ? $"did you mean '{near}'? Accepted columns: {string.Join(", ", suggestions)}; columns starting with 'note' are ignored"
                : $"accepted columns: {string.Join(", ", suggestions)}; columns starting with 'note' are ignored";
            problems.Add(table, 1, name, name, "unknown column", fix);
        }
    }

    /// <summary>Reports a missing required column; returns whether it is present.</summary>
    public static bool Require(CsvTable table, string column, string meaning, ProblemList problems)
    {
        if (table.Has(column))
        {
            return true;
        }

        problems.Add(table, 1, column, null, $"required column '{column}' is missing", $"add a '{column}' column ({meaning})");
        return false;
    }

    /// <summary>Columns starting with <paramref name="prefix"/>, in header order, with the part after the prefix.</summary>
    public static List<(int Index, string Name)> Family(CsvTable table, string prefix)
    {
        var result = new List<(int, string)>();
        for (int i = 0; i < table.Header.Count; i++)
        {
            var h = table.Header[i];
            if (h.Length > prefix.Length && h.StartsWith(prefix, StringComparison.OrdinalIgnoreCase))
            {
                result.Add((i, h[prefix.Length..]));
            }
        }

        return result;
    }

    private static bool IsKnown(string name, IReadOnlyList<string> known, IReadOnlyList<string> prefixes)
    {
        foreach (var k in known)
        {
            if (string.Equals(k, name, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }

        foreach (var p in prefixes)
        {
            if (name.Length > p.Length && name.StartsWith(p, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }

        return false;
    }

    // A typo of a prefixed family ("demnad_kg") is compared against the family spelled with the typed suffix.
    private static IEnumerable<string> Candidates(string name, IReadOnlyList<string> known, IReadOnlyList<string> prefixes)
    {
        foreach (var k in known)
        {
            yield return k;
        }

        int underscore = name.IndexOf('_', StringComparison.Ordinal);
        foreach (var p in prefixes)
        {
            yield return underscore >= 0 && underscore + 1 < name.Length ? p + name[(underscore + 1)..] : p;
        }
    }
}
