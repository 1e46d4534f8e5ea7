using Anneal.Core.Solving;

namespace Anneal.Experiments.Analysis;

/// <summary>A finished run with its convergence trace and the reference its trace is measured against, in objective units.</summary>
public sealed record TracedRun(BenchRow Row, IReadOnlyList<TracePoint> Trace, double Reference);
