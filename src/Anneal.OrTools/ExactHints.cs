namespace Anneal.OrTools;

/// <summary>Proven facts about every plan that keeps the hard rules, handed to the exact model so that its proof starts from them.</summary>
/// <param name="MinVehicles">At least this many routes.</param>
/// <param name="ObjectiveAtLeast">The objective is at least this (a proven lower bound).</param>
public sealed record ExactHints(int MinVehicles, double? ObjectiveAtLeast);
