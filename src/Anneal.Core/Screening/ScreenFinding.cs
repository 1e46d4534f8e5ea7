namespace Anneal.Core.Screening;

/// <summary>A stop that no vehicle can ever serve without breaking a hard rule, and why.</summary>
public sealed record ScreenFinding(int StopIndex, string StopId, string Reason);
