using Anneal.Core.Model;

namespace Anneal.Jobs;

/// <summary>What a host asks of a run; null means "the job's setting, else the default".</summary>
public sealed record JobRequest
{
    /// <summary>Comma-separated solver names; null: the job's list, else every default solver that applies.</summary>
    public string? Solvers { get; init; }

    public double? TimeSeconds { get; init; }

    /// <summary>Budget when neither the request nor the job gives one.</summary>
    public double DefaultTimeSeconds { get; init; } = 30;

    public long? Iterations { get; init; }

    public double? Target { get; init; }

    public Objective? Objective { get; init; }

    public int? Seed { get; init; }

    /// <summary>Independent searches per solver (SolveOptions.Threads).</summary>
    public int Threads { get; init; } = 1;

    /// <summary>
    /// True when the budget covers the whole run, its files included (solve, the worker): the solvers then get what
    /// is left after <see cref="Spent"/> and the expected writing time (see <see cref="WallClockBudget"/>).
    /// False (bench): the budget is the solvers' own.
    /// </summary>
    public bool WholeRun { get; init; }

    /// <summary>Time of the budget gone before the run (start-up, reading the job).</summary>
    public TimeSpan Spent { get; init; }

    /// <summary>Re-plan from a given plan (`--from`, `--now`, `--without`); null to plan from nothing.</summary>
    public Replanning.ReplanInput? Replan { get; init; }
}
