using Anneal.Core.Model;
using Anneal.Jobs;

namespace Anneal.Cli.Commands;

/// <summary>What the user asked of `solve` on the command line; null means "take the job's setting or the default".</summary>
public sealed record SolveRequest
{
    public string? Solvers { get; init; }
    public double? TimeSeconds { get; init; }
    public long? Iterations { get; init; }
    public double? Target { get; init; }
    public string? Objective { get; init; }
    public int? Seed { get; init; }
    public int? Threads { get; init; }
    public string? OutDir { get; init; }
    public bool Quiet { get; init; }

    /// <summary>`--from`: the plan to start from; `--now` (minutes of the day) and `--without` (comma-separated vehicle ids) re-plan it.</summary>
    public string? From { get; init; }
    public double? Now { get; init; }
    public string? Without { get; init; }

    /// <summary>The request as the job runner takes it (the objective's text already checked by the parser).</summary>
    /// <param name="spent">Time since the process started: the budget covers the whole run, start-up and files included.</param>
    public JobRequest ToJob(double defaultTimeSeconds, TimeSpan spent) => new()
    {
        WholeRun = true,
        Spent = spent,
        Solvers = Solvers,
        TimeSeconds = TimeSeconds,
        DefaultTimeSeconds = defaultTimeSeconds,
        Iterations = Iterations,
        Target = Target,
        Objective = ObjectiveNames.TryParse(Objective, out var o) ? o : null,
        Seed = Seed,
        Threads = Threads ?? 1,
        Replan = From is null ? null : new Anneal.Jobs.Replanning.ReplanInput(From, Now,
            (Without ?? string.Empty).Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)),
    };
}
