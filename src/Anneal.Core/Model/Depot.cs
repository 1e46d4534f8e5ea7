namespace Anneal.Core.Model;

public sealed record Depot
{
    public required string Id { get; init; }

    /// <summary>What the driver reads; empty when the input gives none.</summary>
    public string Name { get; init; } = string.Empty;

    /// <summary>Where the depot is, as written in the input; empty when it gives none.</summary>
    public string Address { get; init; } = string.Empty;
    public required double X { get; init; }
    public required double Y { get; init; }
}
