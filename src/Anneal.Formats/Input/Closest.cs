namespace Anneal.Formats.Input;

/// <summary>Finds the known name a typo most likely meant (Levenshtein 1966 edit distance).</summary>
public static class Closest
{
    /// <summary>The nearest candidate, or null when none is near enough to be a plausible typo.</summary>
    public static string? Find(string typed, IEnumerable<string> candidates)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        var t = typed.ToLowerInvariant();
        foreach (var c in candidates)
        {
            int d = Distance(t, c.ToLowerInvariant());
            if (d < bestDistance)
            {
                best = c;
                bestDistance = d;
            }
        }

        int allowed = Math.Max(2, typed.Length / 3);
        return bestDistance <= allowed ? best : null;
    }

    public static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++)
        {
            previous[j] = j;
        }

        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int substitute = previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
                current[j] = Math.Min(substitute, Math.Min(previous[j] + 1, current[j - 1] + 1));
            }

            (previous, current) = (current, previous);
        }

        return previous[b.Length];
    }
}
