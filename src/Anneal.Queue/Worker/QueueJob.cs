using Anneal.Queue.Jobs;

namespace Anneal.Queue.Worker;

/// <summary>A job this worker has claimed: <paramref name="Claim"/> is its fencing token, checked by every write of its result.</summary>
public sealed record QueueJob(long Id, string Name, string Kind, long Claim, int Attempt, JobSpec Spec, DateTimeOffset ClaimedAt);
