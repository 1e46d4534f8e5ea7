namespace Anneal.Worker;

/// <summary>What the status file holds: one worker's counts and its running jobs.</summary>
/// <param name="State">"running", "stopping" or "stopped".</param>
public sealed record WorkerStatus(
    string Worker,
    string Host,
    int Pid,
    string State,
    DateTimeOffset StartedAt,
    DateTimeOffset UpdatedAt,
    int Done,
    int Failed,
    int Requeued,
    IReadOnlyList<RunningJobStatus> Running,
    IReadOnlyList<FinishedJobStatus> Recent)
{
    /// <summary>The version of Anneal this worker runs.</summary>
    public string AnnealVersion { get; init; } = Anneal.Formats.Output.ToolVersion.Version;

    /// <summary>The commit that version was built from.</summary>
    public string Commit { get; init; } = Anneal.Formats.Output.ToolVersion.Commit;
}

/// <summary>A job being solved, with each solver's best so far.</summary>
public sealed record RunningJobStatus(string Job, int Attempt, DateTimeOffset ClaimedAt, double ElapsedSeconds, IReadOnlyList<SolverStatus> Solvers);

public sealed record SolverStatus(string Solver, double BestObjective, bool Feasible, double Seconds, long Iteration);

/// <summary>A job this worker finished: "solved", "interrupted", "requeued", "failed" or "retry".</summary>
public sealed record FinishedJobStatus(string Job, string Result, string Where, DateTimeOffset FinishedAt);
