namespace Anneal.Formats.Output.Runs;

/// <summary>One route of the written plan: the vehicle's id and its stops' ids in visiting order.</summary>
public sealed record RouteRecord(string Vehicle, IReadOnlyList<string> Stops);
