namespace Anneal.Core.Solving;

/// <summary>
/// Why a solver stopped: the one vocabulary of summary.json's <c>status</c>, the printed summary, run.json, the
/// report and the worker. The texts (<see cref="SolverStatusNames.ToText"/>) are the README's.
/// </summary>
public enum SolverStatus
{
    /// <summary>"completed": the search ended by itself (construction done, the engine's own search over).</summary>
    Completed,

    /// <summary>"optimal": the search ended by itself with a proven optimum.</summary>
    Optimal,

    /// <summary>"iteration limit": the --iterations budget stopped it.</summary>
    IterationLimit,

    /// <summary>"time limit": the clock stopped it.</summary>
    TimeLimit,

    /// <summary>"target reached": it held a feasible plan at or below --target.</summary>
    TargetReached,

    /// <summary>"interrupted": Ctrl+C, SIGTERM or a stop request cut it short; its best plan so far is kept.</summary>
    Interrupted,

    /// <summary>
    /// "overran": it did not return within the tolerance past its budget or a stop request, and the run went on
    /// without waiting; its plan, if any, is the best it had reported by then.
    /// </summary>
    Overran,

    /// <summary>"no solution": it ended without any plan.</summary>
    NoSolution,

    /// <summary>"declined": the solver does not apply to this instance or cannot express the job (the note says why).</summary>
    Declined,
}

public static class SolverStatusNames
{
    public static string ToText(this SolverStatus status) => status switch
    {
        SolverStatus.Completed => "completed",
        SolverStatus.Optimal => "optimal",
        SolverStatus.IterationLimit => "iteration limit",
        SolverStatus.TimeLimit => "time limit",
        SolverStatus.TargetReached => "target reached",
        SolverStatus.Interrupted => "interrupted",
        SolverStatus.Overran => "overran",
        SolverStatus.NoSolution => "no solution",
        SolverStatus.Declined => "declined",
        _ => throw new ArgumentOutOfRangeException(nameof(status)),
    };

    /// <summary>Every status, in the order of the enum (for documentation and checks).</summary>
    public static IReadOnlyList<SolverStatus> All { get; } = Enum.GetValues<SolverStatus>();
}
