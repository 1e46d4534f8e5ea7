namespace Anneal.Worker;

/// <summary>How the command asked the worker to run and how it ended; shared by the command and the service.</summary>
public sealed class WorkerRun
{
    /// <summary>Process what the inbox holds, then stop (for cron and tests).</summary>
    public bool Once { get; init; }

    /// <summary>Jobs come from the inbox folder (false: from elsewhere, such as the database worker; the folders are then not required).</summary>
    public bool UsesFolders { get; init; } = true;

    /// <summary>The worker stopped by itself (--once found the inbox empty), not on a stop request.</summary>
    public bool FinishedByItself { get; set; }

    /// <summary>Jobs whose plans could not be published because the outbox's disk was full (they are back in the inbox).</summary>
    public int Unpublished { get; set; }

    /// <summary>Set when the worker could not run at all (its folders cannot be created or written).</summary>
    public Exception? Failure { get; set; }
}
