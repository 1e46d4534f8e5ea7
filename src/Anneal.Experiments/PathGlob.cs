namespace Anneal.Experiments;

/// <summary>
/// Expands `*` and `?` in a path, segment by segment (for shells that do not, and for experiment files);
/// `**` matches any depth of folders. Matches come back sorted so that a plan is the same on every machine.
/// </summary>
public static class PathGlob
{
    public static bool IsPattern(string path) => path.Contains('*') || path.Contains('?');

    public static IReadOnlyList<string> Expand(string pattern)
    {
        string full = Path.GetFullPath(pattern.Replace('\\', '/'));
        string root = Path.GetPathRoot(full) ?? "/";
        var segments = full[root.Length..].Split('/', StringSplitOptions.RemoveEmptyEntries);
        var current = new List<string> { root };
        for (int i = 0; i < segments.Length; i++)
        {
            string segment = segments[i];
            bool last = i == segments.Length - 1;
            var next = new List<string>();
            foreach (var folder in current)
            {
                if (segment == "**")
                {
                    next.Add(folder);
                    next.AddRange(SafeDirectories(folder, "*", SearchOption.AllDirectories));
                }
                else if (!IsPattern(segment))
                {
                    string path = Path.Combine(folder, segment);
                    if (Directory.Exists(path) || (last && File.Exists(path)))
                    {
                        next.Add(path);
                    }
                }
                else
                {
                    next.AddRange(SafeDirectories(folder, segment, SearchOption.TopDirectoryOnly));
                    if (last && Directory.Exists(folder))
                    {
                        next.AddRange(Directory.EnumerateFiles(folder, segment));
                    }
                }
            }

            current = next.Distinct(StringComparer.Ordinal).ToList();
        }

        current.Sort(StringComparer.Ordinal);
        return current;
    }

    private static IEnumerable<string> SafeDirectories(string folder, string pattern, SearchOption option) =>
        Directory.Exists(folder) ? Directory.EnumerateDirectories(folder, pattern, option) : [];
}
