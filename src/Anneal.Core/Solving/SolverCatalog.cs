using Anneal.Core.Model;

namespace Anneal.Core.Solving;

/// <summary>A solver the host offers, by the name users type.</summary>
/// <param name="ByDefault">Runs when the user names no solver (and the solver applies to the instance).</param>
public sealed record SolverRegistration(string Name, Func<ISolver> Create, bool ByDefault = true);

/// <summary>
/// The solvers one host offers, built once at start-up from its registrations (see <c>AddAnneal</c>) and read-only
/// after: every command, the worker and the bench ask the same catalogue, so they agree on names and wording.
/// </summary>
public sealed class SolverCatalog
{
    private readonly List<SolverRegistration> _entries = [];

    /// <param name="registrations">In the order defaults run; a later registration of a name replaces the earlier one.</param>
    public SolverCatalog(IEnumerable<SolverRegistration> registrations)
    {
        foreach (var r in registrations)
        {
            int at = _entries.FindIndex(e => string.Equals(e.Name, r.Name, StringComparison.OrdinalIgnoreCase));
            if (at >= 0)
            {
                _entries[at] = r;
            }
            else
            {
                _entries.Add(r);
            }
        }
    }

    /// <summary>Every name, sorted, as messages list them.</summary>
    public IReadOnlyList<string> Names
    {
        get
        {
            var names = _entries.ConvertAll(e => e.Name);
            names.Sort(StringComparer.Ordinal);
            return names;
        }
    }

    public bool Exists(string name) => Find(name) is not null;

    /// <exception cref="UnknownSolverException">when no solver has this name.</exception>
    public ISolver Create(string name) => (Find(name) ?? throw Unknown(name)).Create();

    /// <summary>Solvers run when the user names none: the default ones that apply to the instance, else any that applies.</summary>
    public IReadOnlyList<string> Defaults(Instance instance)
    {
        var list = new List<string>();
        foreach (var e in _entries)
        {
            var solver = e.Create();
            if (e.ByDefault && solver.Declines(instance) is null && (solver as ISolverAdvice)?.LeftOutOfDefaults(instance) is null)
            {
                list.Add(e.Name);
            }
        }

        foreach (var e in _entries)
        {
            if (list.Count == 0 && !e.ByDefault && e.Create().Declines(instance) is null)
            {
                list.Add(e.Name);
            }
        }

        return list;
    }

    /// <summary>Why default solvers that apply to the instance are left out of <see cref="Defaults"/> on it (one line each).</summary>
    public IReadOnlyList<string> LeftOut(Instance instance)
    {
        var reasons = new List<string>();
        foreach (var e in _entries)
        {
            var solver = e.Create();
            if (e.ByDefault && solver.Declines(instance) is null && (solver as ISolverAdvice)?.LeftOutOfDefaults(instance) is { } reason)
            {
                reasons.Add(reason);
            }
        }

        return reasons;
    }

    /// <summary>The command line's comma-separated list first, then the job's list, then the defaults; duplicates dropped.</summary>
    /// <exception cref="UnknownSolverException">when a name is unknown or the list names none.</exception>
    public IReadOnlyList<string> Resolve(string? commandLine, IReadOnlyList<string>? fromJob, Instance instance) =>
        Known(commandLine is not null ? Split(commandLine) : fromJob ?? Defaults(instance));

    /// <summary>The names as the catalogue spells them, duplicates dropped.</summary>
    /// <exception cref="UnknownSolverException">when a name is unknown or there is none.</exception>
    public IReadOnlyList<string> Known(IEnumerable<string> asked)
    {
        var names = new List<string>();
        foreach (var name in asked)
        {
            var entry = Find(name) ?? throw Unknown(name);
            if (!names.Contains(entry.Name))
            {
                names.Add(entry.Name);
            }
        }

        return names.Count > 0 ? names : throw Unknown(string.Empty);
    }

    /// <summary>"sa, tabu" → ["sa", "tabu"]; empty parts and spaces dropped.</summary>
    public static string[] Split(string list) => list.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    /// <summary>The one wording of an unknown name, for every host.</summary>
    public UnknownSolverException Unknown(string name) => new(name, Names);

    private SolverRegistration? Find(string name) =>
        _entries.Find(e => string.Equals(e.Name, name, StringComparison.OrdinalIgnoreCase));
}
