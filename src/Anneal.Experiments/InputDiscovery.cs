namespace Anneal.Experiments;

/// <summary>Turns the paths a user gives into instance inputs: files as they are, folders into their benchmark files and job folders.</summary>
public static class InputDiscovery
{
    private static readonly string[] BenchmarkExtensions = [".txt", ".vrp"];

    public static IReadOnlyList<string> Expand(IEnumerable<string> paths)
    {
        var found = new List<string>();
        foreach (var path in paths)
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
                    continue;
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

        return found;
    }
}
