namespace Anneal.Worker;

/// <summary>How a claimed job left this worker.</summary>
public enum JobResult
{
    /// <summary>Solved within its budget; its folder is in the outbox.</summary>
    Solved,

    /// <summary>Cut short by a stop request; the interrupted plan is its result (OnShutdown = Complete).</summary>
    Interrupted,

    /// <summary>Back in the inbox as it was (a stop request; any interrupted plan is published and will be replaced).</summary>
    Requeued,

    /// <summary>In failed/ with error.txt.</summary>
    Failed,

    /// <summary>Back in the inbox with one more retry counted, after an unexpected error.</summary>
    Retry,

    /// <summary>
    /// Back in the inbox as it was: the outbox's disk was full when its plan was to be published. The machine's fault,
    /// not the job's, so no attempt is counted; the worker backs off before claiming again.
    /// </summary>
    NoSpace,
}
