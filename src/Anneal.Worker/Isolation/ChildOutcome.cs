namespace Anneal.Worker.Isolation;

/// <summary>How a job's solver process ended, as the worker sees it.</summary>
public abstract record ChildOutcome
{
    /// <summary>It wrote the run's files and reported the chosen plan (interrupted or not).</summary>
    public sealed record Completed(ChildResult Result) : ChildOutcome;

    /// <summary>It ended without a result: a crash, a kill (e.g. out of memory) or a hang past its budget; the reason says which.</summary>
    public sealed record Failed(string Reason) : ChildOutcome;

    /// <summary>It could not write the run's files: the outbox's disk is full (not the job's fault).</summary>
    public sealed record NoSpace(string Reason) : ChildOutcome;

    /// <summary>The worker was stopping and the process ended (or was ended) before it wrote a plan.</summary>
    public sealed record Stopped : ChildOutcome;
}
