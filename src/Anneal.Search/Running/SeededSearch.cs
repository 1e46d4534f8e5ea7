using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.Search.Running;

/// <summary>A seeded search: with --threads N it runs N independent copies and keeps the best; else it runs once.</summary>
public abstract class SeededSearch : ISolver
{
    public abstract string Name { get; }

    public abstract string? Declines(Instance instance);

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel) =>
        options.Threads > 1
            ? ParallelRuns.Run(() => this, instance, options, progress, cancel)
            : SolveOnce(instance, options, progress, cancel);

    /// <summary>One run on one thread. Must keep no state between calls: parallel copies share the instance of this class.</summary>
    protected abstract SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel);
}
