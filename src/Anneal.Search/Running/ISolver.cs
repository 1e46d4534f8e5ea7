using Anneal.Core.Model;

namespace Anneal.Search.Running;

/// <summary>A way of finding a plan. Cancellation stops it early; it still returns its best plan.</summary>
public interface ISolver
{
    string Name { get; }

    SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel);
}
