namespace Anneal.Tests.Fixtures;

/// <summary>Locates ../shared/benchmarks beside the repository; tests skip (not pass) when it is absent.</summary>
internal static class BenchmarkData
{
    private static readonly Lazy<string?> RootLazy = new(Find);

    public static string? Root => RootLazy.Value;

    /// <summary>Full path of a file under the benchmarks folder; skips the calling test when the folder is absent.</summary>
    public static string File(string relative)
    {
        Skip.If(Root is null, "../shared/benchmarks is absent beside the repository; benchmark-based test skipped");
        var path = Path.Combine(Root!, relative);
        Skip.IfNot(System.IO.File.Exists(path), $"{relative} is absent from ../shared/benchmarks; test skipped");
        return path;
    }

    public static string RepoRoot
    {
        get
        {
            var dir = new DirectoryInfo(AppContext.BaseDirectory);
            while (dir is not null && !System.IO.File.Exists(Path.Combine(dir.FullName, "Anneal.sln")))
            {
                dir = dir.Parent;
            }

            return dir?.FullName ?? throw new InvalidOperationException("repository root (Anneal.sln) not found above " + AppContext.BaseDirectory);
        }
    }

    private static string? Find()
    {
        var env = Environment.GetEnvironmentVariable("ANNEAL_BENCHMARKS");
        if (!string.IsNullOrEmpty(env) && Directory.Exists(env))
        {
            return env;
        }

        var candidate = Path.GetFullPath(Path.Combine(RepoRoot, "..", "shared", "benchmarks"));
        return Directory.Exists(candidate) ? candidate : null;
    }
}
