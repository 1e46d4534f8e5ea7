using System.Reflection;

namespace Anneal.Worker.Isolation;

/// <summary>How to start the `anneal` executable itself as a job's solver process: the apphost, or `dotnet anneal.dll`.</summary>
public sealed record SolverProcess(string FileName, IReadOnlyList<string> Prefix)
{
    /// <summary>The running executable: its apphost, or the dotnet host with the entry assembly when run as `dotnet anneal.dll`.</summary>
    public static SolverProcess Current()
    {
        string path = Environment.ProcessPath ?? "anneal";
        string? entry = Assembly.GetEntryAssembly()?.Location;
        bool dotnetHost = Path.GetFileNameWithoutExtension(path).Equals("dotnet", StringComparison.OrdinalIgnoreCase);
        return dotnetHost && !string.IsNullOrEmpty(entry) ? new SolverProcess(path, [entry]) : new SolverProcess(path, []);
    }
}
