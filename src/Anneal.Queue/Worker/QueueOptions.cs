namespace Anneal.Queue.Worker;

/// <summary>
/// The database worker's own settings, from the "Queue" section (appsettings.json, ANNEAL_Queue__* variables, the
/// command line). Everything else (jobs at once, threads, budget, solvers, MaxRetries, OnShutdown, the shutdown timeout,
/// PollSeconds, RecoverSeconds) is the folder worker's "Worker" section, with the same meaning.
/// </summary>
public sealed class QueueOptions
{
    public const string Section = "Queue";

    /// <summary>Npgsql connection string; `--db` and ANNEAL_DB set it too.</summary>
    public string? ConnectionString { get; set; }

    /// <summary>How long a claim holds without a heartbeat; after that any worker puts the job back (attempt + 1).</summary>
    public double LeaseSeconds { get; set; } = 60;

    /// <summary>How often a running job renews its lease and stores its solvers' best so far; well under LeaseSeconds.</summary>
    public double HeartbeatSeconds { get; set; } = 10;

    /// <summary>Longest wait between attempts to reach a database that stopped answering (waits double from 1 s up to this).</summary>
    public double RetryMaxSeconds { get; set; } = 30;
}
