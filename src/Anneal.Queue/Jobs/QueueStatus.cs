namespace Anneal.Queue.Jobs;

/// <summary>What `anneal queue status` and the status page show: counts by state, the running jobs, the latest failures and results.</summary>
public sealed record QueueStatus(
    int Queued,
    int Running,
    int Done,
    int Failed,
    IReadOnlyList<RunningJob> RunningJobs,
    IReadOnlyList<FailedJob> FailedJobs,
    IReadOnlyList<DoneJob> DoneJobs);

/// <summary>A claimed job with its solvers' best so far (as its worker last reported it) and its time since the claim, by the database's clock.</summary>
public sealed record RunningJob(long Id, string Name, string Worker, int Attempt, DateTimeOffset ClaimedAt, double ElapsedSeconds, DateTimeOffset LeaseUntil, IReadOnlyList<SolverProgress> Solvers);

public sealed record SolverProgress(string Solver, double? BestObjective, bool Feasible, double Seconds, long Iteration);

public sealed record FailedJob(long Id, string Name, int Attempt, DateTimeOffset? FinishedAt, string Reason);

public sealed record DoneJob(long Id, string Name, string Solver, double Objective, int Vehicles, bool Feasible, bool Interrupted, DateTimeOffset FinishedAt);
