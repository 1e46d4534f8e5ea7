namespace Anneal.Core.Model;

public sealed record Depot
{
    public required string Id { get; init; }
    public required double X { get; init; }
    public required double Y { get; init; }
}
