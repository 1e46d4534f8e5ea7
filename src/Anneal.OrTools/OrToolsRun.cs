using Anneal.Core.Solving;

namespace Anneal.OrTools;

/// <summary>A routing run's result, with OR-Tools' own objective for the returned plan (descaled) beside Anneal's verdict.</summary>
/// <param name="EngineObjective">OR-Tools' cost of the returned plan in Anneal's units; null when it found none.</param>
/// <param name="RoutingStatus">OR-Tools' status name after the search.</param>
public sealed record OrToolsRun(SolverResult Result, double? EngineObjective, string RoutingStatus);
