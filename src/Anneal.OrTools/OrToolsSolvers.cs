using Anneal.Search.Running;

namespace Anneal.OrTools;

/// <summary>Makes "ortools" and "exact" known to <see cref="SolverCatalog"/>; the host calls this once at start-up.</summary>
public static class OrToolsSolvers
{
    public static void Register()
    {
        SolverCatalog.Register("ortools", () => new OrToolsSolver());
        SolverCatalog.Register("exact", () => new ExactSolver());
    }
}
