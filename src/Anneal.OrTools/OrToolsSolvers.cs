using Anneal.Search.Running;

namespace Anneal.OrTools;

/// <summary>Makes "ortools", "exact" and "bound" known to <see cref="SolverCatalog"/>; the host calls this once at start-up.</summary>
public static class OrToolsSolvers
{
    public static void Register()
    {
        SolverCatalog.Register("ortools", () => new OrToolsSolver());
        SolverCatalog.Register("exact", () => new ExactSolver());
        SolverCatalog.Register("bound", () => new Bounds.BoundSolver());
    }
}
