using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Running;

namespace Anneal.Search.Construction;

/// <summary>Placeholder until the insertion heuristic lands: returns every stop unserved.</summary>
public sealed class InsertionSolver : ISolver
{
    public string Name => "insertion";

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel) =>
        new(Name, Plan.Empty, 0, 0, Array.Empty<TracePoint>(), "completed");
}
