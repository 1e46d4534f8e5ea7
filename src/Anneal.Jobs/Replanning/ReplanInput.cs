namespace Anneal.Jobs.Replanning;

/// <summary>
/// What a host asks of a re-plan: the plan file to start from (`--from`), the clock time that fixes the past
/// (`--now`, in the job's time unit; null for a warm start) and the vehicle ids taken out (`--without`).
/// </summary>
public sealed record ReplanInput(string PlanPath, double? Now, IReadOnlyList<string> Without);
