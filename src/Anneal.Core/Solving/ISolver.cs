using Anneal.Core.Model;

namespace Anneal.Core.Solving;

/// <summary>A way of finding a plan. Cancellation stops it early; it still returns its best plan.</summary>
public interface ISolver
{
    string Name { get; }

    /// <summary>Null when the solver can take this instance; otherwise why not, in words (it then returns <see cref="SolverStatus.Declined"/>).</summary>
    string? Declines(Instance instance);

    SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel);
}
