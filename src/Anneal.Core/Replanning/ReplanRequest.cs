namespace Anneal.Core.Replanning;

/// <summary>
/// How to re-plan from a given plan: <see cref="Now"/> (in the job's time unit; null for a warm start that fixes
/// nothing) and the vehicles taken out (indices into the job's vehicles).
/// </summary>
public sealed record ReplanRequest(GivenPlan Plan, double? Now, IReadOnlySet<int> Without);
