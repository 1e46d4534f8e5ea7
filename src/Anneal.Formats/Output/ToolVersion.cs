using System.Reflection;

namespace Anneal.Formats.Output;

/// <summary>
/// What built the outputs: the tool's version and the commit it was built from (stamped at build time from git, or
/// "unknown" without it), so that every summary.json, run.json and machine.json says what made it.
/// </summary>
public static class ToolVersion
{
    private static readonly string Informational =
        typeof(ToolVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "0.0.0+unknown";

    /// <summary>The release number, e.g. "0.1.0".</summary>
    public static string Version { get; } = Informational.Split('+')[0];

    /// <summary>The commit, the full hash from git; "unknown" when the build had no git.</summary>
    public static string Commit { get; } = Informational.Contains('+', StringComparison.Ordinal) ? Informational[(Informational.IndexOf('+', StringComparison.Ordinal) + 1)..] : "unknown";

    /// <summary>"0.1.0 (commit f43935c26a4…)".</summary>
    public static string Text => $"{Version} (commit {Commit})";
}
