namespace Anneal.Benchmarks;

/// <summary>
/// Finds the shared benchmark files: $ANNEAL_BENCHMARKS if set, else ../shared/benchmarks beside the checkout
/// (the folder holding Anneal.sln). Files are never copied into the repository.
/// </summary>
public static class BenchmarkFolder
{
    public const string Variable = "ANNEAL_BENCHMARKS";

    /// <summary>The folder, or null when neither place has it.</summary>
    public static string? Locate()
    {
        var given = Environment.GetEnvironmentVariable(Variable);
        if (!string.IsNullOrEmpty(given))
        {
            return Directory.Exists(given) ? Path.GetFullPath(given) : null;
        }

        // Walk up from the binary: the child processes BenchmarkDotNet starts live deeper under bin/, so the
        // working directory is no guide.
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Anneal.sln")))
            {
                var beside = Path.GetFullPath(Path.Combine(dir.FullName, "..", "shared", "benchmarks"));
                return Directory.Exists(beside) ? beside : null;
            }
        }

        return null;
    }
}
