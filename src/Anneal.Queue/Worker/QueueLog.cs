using Microsoft.Extensions.Logging;

namespace Anneal.Queue.Worker;

/// <summary>Every message of the database worker, with a stable event id (25xx) so that log collectors can filter by it.</summary>
internal static partial class QueueLog
{
    [LoggerMessage(EventId = 2501, EventName = "WorkerStarted", Level = LogLevel.Information,
        Message = "Worker {WorkerId} serving the queue at {Database}; up to {Jobs} job(s) at a time, {Seconds} s each unless a job says otherwise; lease {LeaseSeconds} s{Once}")]
    public static partial void WorkerStarted(ILogger log, string workerId, string database, int jobs, double seconds, double leaseSeconds, string once);

    [LoggerMessage(EventId = 2502, EventName = "WorkerStopping", Level = LogLevel.Information,
        Message = "Worker {WorkerId} stopping: {Running} running job(s) are storing their best plans")]
    public static partial void WorkerStopping(ILogger log, string workerId, int running);

    [LoggerMessage(EventId = 2503, EventName = "WorkerStopped", Level = LogLevel.Information, Message = "Worker {WorkerId} stopped")]
    public static partial void WorkerStopped(ILogger log, string workerId);

    [LoggerMessage(EventId = 2504, EventName = "DatabaseUnreachable", Level = LogLevel.Warning,
        Message = "The queue database cannot be used ({Reason}); trying again in {Seconds} s")]
    public static partial void DatabaseUnreachable(ILogger log, string reason, double seconds);

    [LoggerMessage(EventId = 2505, EventName = "DatabaseBack", Level = LogLevel.Information,
        Message = "The queue database answers again; looking for work")]
    public static partial void DatabaseBack(ILogger log);

    [LoggerMessage(EventId = 2506, EventName = "JobClaimed", Level = LogLevel.Information,
        Message = "Job {JobId} ({JobName}) claimed: attempt {Attempt}, claim {Claim}")]
    public static partial void JobClaimed(ILogger log, long jobId, string jobName, int attempt, long claim);

    [LoggerMessage(EventId = 2507, EventName = "JobStarted", Level = LogLevel.Information,
        Message = "Job {JobId} started: {Stops} stops, solvers {Solvers}, up to {Budget} s")]
    public static partial void JobStarted(ILogger log, long jobId, int stops, string solvers, double budget);

    [LoggerMessage(EventId = 2508, EventName = "JobProgress", Level = LogLevel.Information,
        Message = "Job {JobId}: {Solver} best {BestObjective:F2} ({Feasibility}) after {Elapsed:F1} s")]
    public static partial void JobProgress(ILogger log, long jobId, string solver, double bestObjective, string feasibility, double elapsed);

    [LoggerMessage(EventId = 2509, EventName = "JobStored", Level = LogLevel.Information,
        Message = "Job {JobId} {Outcome}: {Solver} objective {BestObjective:F2} ({Feasibility}), {Vehicles} vehicles, after {Elapsed:F1} s")]
    public static partial void JobStored(ILogger log, long jobId, string outcome, string solver, double bestObjective, string feasibility, int vehicles, double elapsed);

    [LoggerMessage(EventId = 2510, EventName = "ResultRefused", Level = LogLevel.Warning,
        Message = "Job {JobId}: the result of claim {Claim} was refused: the job was claimed again meanwhile (its lease ran out), so the newer attempt's result stands")]
    public static partial void ResultRefused(ILogger log, long jobId, long claim);

    [LoggerMessage(EventId = 2511, EventName = "LeaseLost", Level = LogLevel.Warning,
        Message = "Job {JobId}: its lease was lost (claim {Claim} is no longer current); the search stops")]
    public static partial void LeaseLost(ILogger log, long jobId, long claim);

    [LoggerMessage(EventId = 2512, EventName = "JobInvalid", Level = LogLevel.Warning,
        Message = "Job {JobId} has invalid input ({Problems}); marked failed")]
    public static partial void JobInvalid(ILogger log, long jobId, string problems);

    [LoggerMessage(EventId = 2513, EventName = "JobError", Level = LogLevel.Error,
        Message = "Job {JobId} failed on attempt {Attempt}: {Reason}; {Next}")]
    public static partial void JobError(ILogger log, long jobId, int attempt, string reason, string next);

    [LoggerMessage(EventId = 2514, EventName = "LeaseExpired", Level = LogLevel.Warning,
        Message = "Job {JobId} ({JobName}): the lease of worker {DeadWorker} ran out; {Next}")]
    public static partial void LeaseExpired(ILogger log, long jobId, string jobName, string deadWorker, string next);

    [LoggerMessage(EventId = 2515, EventName = "StoreRetry", Level = LogLevel.Warning,
        Message = "Job {JobId}: its result cannot be stored yet ({Reason}); the plan is kept and storing is tried again in {Seconds} s")]
    public static partial void StoreRetry(ILogger log, long jobId, string reason, double seconds);

    [LoggerMessage(EventId = 2516, EventName = "StoreAbandoned", Level = LogLevel.Error,
        Message = "Job {JobId}: its result could not be stored before the worker stopped; its lease will run out and another worker will solve it again")]
    public static partial void StoreAbandoned(ILogger log, long jobId);

    [LoggerMessage(EventId = 2517, EventName = "HeartbeatFailed", Level = LogLevel.Warning,
        Message = "Job {JobId}: the lease cannot be renewed ({Reason}); the search goes on")]
    public static partial void HeartbeatFailed(ILogger log, long jobId, string reason);

    [LoggerMessage(EventId = 2518, EventName = "ListenerLost", Level = LogLevel.Warning,
        Message = "Listening for new jobs stopped ({Reason}); polling every {Seconds} s until it is back")]
    public static partial void ListenerLost(ILogger log, string reason, double seconds);

    [LoggerMessage(EventId = 2519, EventName = "WorkerCannotRun", Level = LogLevel.Critical, Message = "The worker cannot run: {Reason}")]
    public static partial void WorkerCannotRun(ILogger log, string reason);

    [LoggerMessage(EventId = 2520, EventName = "SolverProcessFailed", Level = LogLevel.Error,
        Message = "Job {JobId} failed in its solver process: {Reason}; marked failed, and the worker goes on")]
    public static partial void SolverFailed(ILogger log, long jobId, string reason);
}
