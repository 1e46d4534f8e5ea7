namespace Anneal.OrTools;

/// <summary>How the exact CP-SAT model runs.</summary>
public sealed record ExactSettings
{
    /// <summary>Above this many stops the exact model declines (proofs grow exponentially).</summary>
    public int StopLimit { get; init; } = 30;

    /// <summary>CP-SAT search workers; null means the run's thread count.</summary>
    public int? Workers { get; init; }
}
