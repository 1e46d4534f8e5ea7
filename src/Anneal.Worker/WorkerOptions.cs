namespace Anneal.Worker;

/// <summary>
/// The worker's settings, bound from the "Worker" section of appsettings.json, ANNEAL_Worker__* environment variables
/// and the command line (later sources win). Checked at start-up by <see cref="WorkerOptionsValidator"/>.
/// </summary>
public sealed class WorkerOptions
{
    public const string Section = "Worker";

    /// <summary>Where jobs are dropped. Required.</summary>
    public string? Inbox { get; set; }

    /// <summary>Where each finished job's folder appears, complete or not at all. Required.</summary>
    public string? Outbox { get; set; }

    /// <summary>Claimed jobs; default: "working" beside the inbox. Must be on the inbox's file system (claims are renames).</summary>
    public string? Working { get; set; }

    /// <summary>Jobs that cannot be solved, each with error.txt; default: "failed" beside the inbox. Same file system as the inbox.</summary>
    public string? Failed { get; set; }

    /// <summary>Jobs solved at the same time by this worker.</summary>
    public int ConcurrentJobs { get; set; } = 1;

    /// <summary>Independent searches per solver within one job (SolveOptions.Threads).</summary>
    public int ThreadsPerJob { get; set; } = 1;

    /// <summary>Search budget for a job whose settings.json gives no timeSeconds.</summary>
    public double TimeSeconds { get; set; } = 60;

    /// <summary>Comma-separated solver names for every job; empty: the job's own list, else the catalogue's defaults.</summary>
    public string? Solvers { get; set; }

    /// <summary>Times a job is retried after its worker died or failed unexpectedly before it goes to the failed folder.</summary>
    public int MaxRetries { get; set; } = 2;

    public ShutdownChoice OnShutdown { get; set; } = ShutdownChoice.Requeue;

    /// <summary>Time the host gives running jobs to write their plans after a stop request.</summary>
    public double ShutdownTimeoutSeconds { get; set; } = 30;

    /// <summary>How often the inbox is scanned.</summary>
    public double PollSeconds { get; set; } = 1;

    /// <summary>
    /// An inbox entry is claimed only when every file in it has kept its size and modification time this long (and
    /// none is open for writing, where the platform tells).
    /// </summary>
    public double SettleSeconds { get; set; } = 2;

    /// <summary>Where each job's search runs: in its own process (the default; a native crash is that job's failure) or in the worker's.</summary>
    public SolverIsolation Isolation { get; set; } = SolverIsolation.Process;

    /// <summary>
    /// A solver process still running this long past its budget (or a quarter of the budget, if longer) counts as hung:
    /// it is sent SIGTERM, killed after ShutdownTimeoutSeconds, and its job fails with that reason.
    /// </summary>
    public double HangGraceSeconds { get; set; } = 30;

    /// <summary>Claim a job folder only once it holds the ready marker (<c>.ready</c>); files are still claimed once settled.</summary>
    public bool RequireReadyMarker { get; set; }

    /// <summary>Largest total size a zipped job may unpack to; a larger one is refused before anything is extracted.</summary>
    public long MaxZipBytes { get; set; } = 256L * 1024 * 1024;

    /// <summary>Largest ratio of unpacked to packed size a zipped job may have (a "zip bomb" is far above it).</summary>
    public double MaxZipRatio { get; set; } = 100;

    /// <summary>How often the status file is rewritten.</summary>
    public double StatusSeconds { get; set; } = 2;

    /// <summary>Create the inbox when it does not exist; otherwise a missing inbox (often a mistyped path) is refused at start-up.</summary>
    public bool CreateFolders { get; set; }

    /// <summary>How often the working folder is searched for jobs left by dead workers (also done at start-up).</summary>
    public double RecoverSeconds { get; set; } = 30;
}

/// <summary>Where a job's search runs.</summary>
public enum SolverIsolation
{
    /// <summary>In a child process (`anneal run-job`): a crash, kill or hang ends that job only.</summary>
    Process,

    /// <summary>In the worker's own process: no start-up cost, but a native crash ends the worker.</summary>
    InProcess,
}
