using Anneal.Core.Plans;
using Anneal.Core.Solving;

namespace Anneal.OrTools;

/// <summary>A routing run's result, with OR-Tools' own view of the solution it returned beside Anneal's verdict.</summary>
/// <param name="EngineObjective">OR-Tools' cost of the solution it returned, in Anneal's units; null when it returned none.</param>
/// <param name="RoutingStatus">OR-Tools' status name after the search.</param>
/// <param name="Engine">That cost part by part, with OR-Tools' lateness per stop.</param>
/// <param name="EnginePlan">The plan of the solution OR-Tools returned (the result's plan is the best by Anneal's evaluator).</param>
public sealed record OrToolsRun(SolverResult Result, double? EngineObjective, string RoutingStatus, EngineCost? Engine = null, Plan? EnginePlan = null);
