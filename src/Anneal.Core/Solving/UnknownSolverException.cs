namespace Anneal.Core.Solving;

/// <summary>A solver name no registration has (or an empty list); the message names the known solvers.</summary>
public sealed class UnknownSolverException : Exception
{
    public UnknownSolverException(string name, IReadOnlyList<string> known)
        : base(name.Length == 0
            ? $"no solver named; known solvers: {string.Join(", ", known)}"
            : $"unknown solver '{name}'; known solvers: {string.Join(", ", known)}")
    {
        Name = name;
        Known = known;
    }

    public UnknownSolverException()
        : this(string.Empty, [])
    {
    }

    public UnknownSolverException(string message)
        : base(message)
    {
        Name = string.Empty;
        Known = [];
    }

    public UnknownSolverException(string message, Exception inner)
        : base(message, inner)
    {
        Name = string.Empty;
        Known = [];
    }

    /// <summary>The name asked for; empty when the list named no solver.</summary>
    public string Name { get; }

    /// <summary>Every name the catalogue knows, sorted.</summary>
    public IReadOnlyList<string> Known { get; }
}
