using Anneal.Core.Model;

namespace Anneal.Experiments;

/// <summary>What a benchmark runs: every solver on every instance with every seed, for every budget.</summary>
public sealed record BenchSettings
{
    public required IReadOnlyList<string> Solvers { get; init; }
    public int Seeds { get; init; } = 3;
    public int FirstSeed { get; init; } = 1;

    /// <summary>Wall-clock budgets per run, seconds; each planned run is repeated for each.</summary>
    public IReadOnlyList<double> Budgets { get; init; } = [10];
    public long? Iterations { get; init; }
    public Objective? Objective { get; init; }

    /// <summary>Runs at once; 1 keeps timings fair on a small machine, and more than the cores makes them unfair.</summary>
    public int Jobs { get; init; } = 1;
}
