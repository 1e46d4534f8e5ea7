using Anneal.Core.Model;

namespace Anneal.Queue.Jobs;

/// <summary>What a submitter asks of a job; null means "the job's setting, else the worker's default".</summary>
public sealed record JobSpec
{
    public string? Solvers { get; init; }

    public double? TimeSeconds { get; init; }

    public long? Iterations { get; init; }

    public Objective? Objective { get; init; }

    public int? Seed { get; init; }

    /// <summary>Higher runs first; equal priorities run in submission order.</summary>
    public int Priority { get; init; }

    /// <summary>The `anneal bench --db` experiment the job is a run of, if any.</summary>
    public long? ExperimentId { get; init; }

    /// <summary>Which run of the experiment it is (its run key), so that a resumed benchmark finds it again.</summary>
    public string? Label { get; init; }
}
