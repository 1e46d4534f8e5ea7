using Anneal.Core.Solving;

namespace Anneal.Reports.Quality;

/// <summary>One benchmark run for the quality-against-runtime plot: which instance, solver and seed, its trace and the reference value (best known).</summary>
public sealed record BenchRun(string Instance, string Solver, int Seed, IReadOnlyList<TracePoint> Trace, double Reference);
