using Anneal.Core.Model;

namespace Anneal.Formats.Input;

/// <summary>Run settings that come with an input (settings.json of a CSV job); command-line values override them.</summary>
public sealed record JobSettings
{
    public Objective? Objective { get; init; }
    public double? TimeSeconds { get; init; }
    public IReadOnlyList<string>? Solvers { get; init; }
    public int? Seed { get; init; }
}
