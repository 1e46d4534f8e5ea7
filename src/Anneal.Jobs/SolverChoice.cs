using Anneal.Search.Running;

namespace Anneal.Jobs;

/// <summary>Which solvers a run uses.</summary>
public static class SolverChoice
{
    /// <summary>Command line first, then the job's list, then the catalogue's defaults; null (with the name) when one is unknown.</summary>
    public static IReadOnlyList<string>? Resolve(string? commandLine, IReadOnlyList<string>? fromJob, Core.Model.Instance instance, out string? unknown)
    {
        IEnumerable<string> asked = commandLine is not null
            ? commandLine.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
            : fromJob ?? SolverCatalog.Defaults(instance);
        var names = new List<string>();
        foreach (var name in asked)
        {
            if (!SolverCatalog.Exists(name))
            {
                unknown = name;
                return null;
            }

            if (!names.Contains(name, StringComparer.OrdinalIgnoreCase))
            {
                names.Add(name);
            }
        }

        unknown = names.Count == 0 ? string.Empty : null;
        return names.Count == 0 ? null : names;
    }
}
