namespace Anneal.Experiments;

/// <summary>Turns the paths a user gives into instance inputs: files as they are, folders into their benchmark files and job folders.</summary>
public static class InputDiscovery
{
    private static readonly string[] BenchmarkExtensions = [".txt", ".vrp"];

    public static IReadOnlyList<string> Expand(IEnumerable<string> paths)
    {
        var found = new List<string>();
        foreach (var given in paths)
        {
            var matches = PathGlob.IsPattern(given) ? PathGlob.Expand(given) : [given];
            if (matches.Count == 0)
            {
                throw new Formats.Input.InputException(new Formats.Input.InputProblem(given, null, null, null,
                    "the pattern matches no file or folder", "check the pattern; * and ? match within a name, ** any depth of folders"));
            }

            foreach (var path in matches)
            {
                AddOne(path, found);
            }
        }

        // The same instance named twice (a folder and a glob inside it) is run once.
        return found.Distinct(StringComparer.Ordinal).ToList();
    }

    private static void AddOne(string path, List<string> found)
    {
        if (File.Exists(path))
        {
            found.Add(path);
        }
        else if (Directory.Exists(path))
        {
            if (File.Exists(Path.Combine(path, "stops.csv")))
            {
                found.Add(path);
                return;
            }

            var inside = new List<string>();
            foreach (var file in Directory.EnumerateFiles(path))
            {
                if (BenchmarkExtensions.Contains(Path.GetExtension(file), StringComparer.OrdinalIgnoreCase))
                {
                    inside.Add(file);
                }
            }

            foreach (var dir in Directory.EnumerateDirectories(path))
            {
                if (File.Exists(Path.Combine(dir, "stops.csv")))
                {
                    inside.Add(dir);
                }
            }

            inside.Sort(StringComparer.Ordinal);
            found.AddRange(inside);
        }
        else
        {
            throw new Formats.Input.InputException(new Formats.Input.InputProblem(path, null, null, null,
                "no such file or folder", "give benchmark files, folders of them, or CSV job folders"));
        }
    }
}
