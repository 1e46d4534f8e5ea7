using Microsoft.Extensions.Logging;

namespace Anneal.Worker;

/// <summary>
/// Every message of the folder worker, with a stable event id (24xx; the database worker has 25xx, the status page
/// 26xx) and name, so that a log collector can filter by them. Ids are never reused or renumbered.
/// </summary>
internal static partial class WorkerLog
{
    [LoggerMessage(EventId = 2401, EventName = "WorkerStarted", Level = LogLevel.Information,
        Message = "Worker {WorkerId} watching {Inbox}; results to {Outbox}, failures to {Failed}; up to {Jobs} job(s) at a time, {Seconds:0.#} s each unless a job says otherwise{Once}")]
    public static partial void WorkerStarted(ILogger log, string workerId, string inbox, string outbox, string failed, int jobs, double seconds, string once);

    [LoggerMessage(EventId = 2402, EventName = "FolderError", Level = LogLevel.Error, Message = "Worker {WorkerId}: {Reason}; trying again")]
    public static partial void FolderError(ILogger log, string workerId, string reason);

    [LoggerMessage(EventId = 2403, EventName = "WorkerStopping", Level = LogLevel.Information,
        Message = "Worker {WorkerId} stopping: {Running} running job(s) are writing their best plans")]
    public static partial void WorkerStopping(ILogger log, string workerId, int running);

    [LoggerMessage(EventId = 2404, EventName = "WorkerStopped", Level = LogLevel.Information, Message = "Worker {WorkerId} stopped")]
    public static partial void WorkerStopped(ILogger log, string workerId);

    [LoggerMessage(EventId = 2405, EventName = "JobClaimed", Level = LogLevel.Information, Message = "Job {JobId} claimed from the inbox as {Entry}")]
    public static partial void JobClaimed(ILogger log, string jobId, string entry);

    [LoggerMessage(EventId = 2406, EventName = "JobNotHandedOn", Level = LogLevel.Error,
        Message = "Job {JobId} could not be handed on: {Reason}; it stays in {Path}")]
    public static partial void JobNotHandedOn(ILogger log, string jobId, string reason, string path);

    [LoggerMessage(EventId = 2407, EventName = "OutboxFull", Level = LogLevel.Error, Message = "Worker: the outbox is full; no job is claimed for {Seconds:0} s")]
    public static partial void OutboxFull(ILogger log, double seconds);

    [LoggerMessage(EventId = 2408, EventName = "StatusNotWritten", Level = LogLevel.Warning, Message = "The status file cannot be written: {Reason}")]
    public static partial void StatusNotWritten(ILogger log, string reason);

    [LoggerMessage(EventId = 2409, EventName = "WorkerCannotRun", Level = LogLevel.Critical, Message = "The worker cannot run: {Reason}")]
    public static partial void WorkerCannotRun(ILogger log, string reason);

    [LoggerMessage(EventId = 2410, EventName = "JobInvalid", Level = LogLevel.Warning,
        Message = "Job {JobId} has invalid input ({Problems}; the first: {First}); moved to {Folder}")]
    public static partial void JobInvalid(ILogger log, string jobId, string problems, string first, string folder);

    [LoggerMessage(EventId = 2411, EventName = "JobStarted", Level = LogLevel.Information,
        Message = "Job {JobId} started (attempt {Attempt}): {Stops} stops, solvers {Solvers}, up to {Budget:0.#} s{Where}")]
    public static partial void JobStarted(ILogger log, string jobId, int attempt, int stops, string solvers, double budget, string where);

    [LoggerMessage(EventId = 2412, EventName = "JobNote", Level = LogLevel.Information, Message = "Job {JobId}: {Note}")]
    public static partial void JobNote(ILogger log, string jobId, string note);

    [LoggerMessage(EventId = 2413, EventName = "JobCrowded", Level = LogLevel.Warning, Message = "Job {JobId}: {Warning}")]
    public static partial void JobCrowded(ILogger log, string jobId, string warning);

    [LoggerMessage(EventId = 2414, EventName = "JobWritten", Level = LogLevel.Information,
        Message = "Job {JobId} {Outcome}: {Solver} objective {BestObjective:F2} ({Feasibility}), {Vehicles} vehicles, after {Elapsed:F1} s; written to {Folder}")]
    public static partial void JobWritten(ILogger log, string jobId, string outcome, string solver, double bestObjective, string feasibility, int vehicles, double elapsed, string folder);

    [LoggerMessage(EventId = 2415, EventName = "JobNoSpace", Level = LogLevel.Error,
        Message = "Job {JobId}: the outbox has no space left ({Reason}); its plan was not published, and it is back in the inbox as {Entry} with no attempt counted")]
    public static partial void JobNoSpace(ILogger log, string jobId, string reason, string entry);

    [LoggerMessage(EventId = 2416, EventName = "InputNotRemoved", Level = LogLevel.Warning,
        Message = "Job {JobId}: the solved input could not be removed from {Path}: {Reason}")]
    public static partial void InputNotRemoved(ILogger log, string jobId, string path, string reason);

    [LoggerMessage(EventId = 2417, EventName = "SolverProcessFailed", Level = LogLevel.Error,
        Message = "Job {JobId} failed in its solver process: {Reason}; moved to {Folder}")]
    public static partial void SolverProcessFailed(ILogger log, string jobId, string reason, string folder);

    [LoggerMessage(EventId = 2418, EventName = "ErrorAfterHandOn", Level = LogLevel.Error,
        Message = "Job {JobId} hit an error after its input was handed on: {Reason}")]
    public static partial void ErrorAfterHandOn(ILogger log, string jobId, string reason);

    [LoggerMessage(EventId = 2419, EventName = "JobGivenUp", Level = LogLevel.Error,
        Message = "Job {JobId} failed for good after {Attempts} attempts: {Reason}; moved to {Folder}")]
    public static partial void JobGivenUp(ILogger log, string jobId, int attempts, string reason, string folder);

    [LoggerMessage(EventId = 2420, EventName = "JobRetried", Level = LogLevel.Error,
        Message = "Job {JobId} failed on attempt {Attempt}: {Reason}; back in the inbox as {Entry}")]
    public static partial void JobRetried(ILogger log, string jobId, int attempt, string reason, string entry);

    [LoggerMessage(EventId = 2421, EventName = "JobProgress", Level = LogLevel.Information,
        Message = "Job {JobId}: {Solver} best {BestObjective:F2} ({Feasibility}) after {Elapsed:F1} s")]
    public static partial void JobProgress(ILogger log, string jobId, string solver, double bestObjective, string feasibility, double elapsed);

    [LoggerMessage(EventId = 2422, EventName = "DeadWorkerJobPublished", Level = LogLevel.Information,
        Message = "Job {JobId} left by dead worker {DeadWorker} was already published to {Folder}; its input is removed")]
    public static partial void DeadWorkerJobPublished(ILogger log, string jobId, string deadWorker, string folder);

    [LoggerMessage(EventId = 2423, EventName = "DeadWorkerJobGivenUp", Level = LogLevel.Warning,
        Message = "Job {JobId} left by dead worker {DeadWorker} failed for good after {Attempts} attempts: {Folder}")]
    public static partial void DeadWorkerJobGivenUp(ILogger log, string jobId, string deadWorker, int attempts, string folder);

    [LoggerMessage(EventId = 2424, EventName = "DeadWorkerJobRequeued", Level = LogLevel.Warning,
        Message = "Job {JobId} left by dead worker {DeadWorker} is back in the inbox as {Entry} (retry {Retry} of {MaxRetries})")]
    public static partial void DeadWorkerJobRequeued(ILogger log, string jobId, string deadWorker, string entry, int retry, int maxRetries);
}
