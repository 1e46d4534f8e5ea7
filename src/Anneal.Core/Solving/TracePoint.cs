namespace Anneal.Core.Solving;

/// <summary>One sample of a run's convergence. Costs are the reported objective (no search penalties).</summary>
/// <param name="State">Strategy state in a few words, e.g. "T=12.5" or "tenure=18".</param>
public sealed record TracePoint(double Seconds, long Iteration, double BestObjective, double CurrentObjective, bool BestFeasible, string State);
