using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>How the OR-Tools routing search runs; the defaults were chosen by measurement on Solomon instances (see the README).</summary>
public sealed record OrToolsSettings
{
    public FirstSolutionStrategy.Types.Value FirstSolution { get; init; } = FirstSolutionStrategy.Types.Value.Savings;

    public LocalSearchMetaheuristic.Types.Value Metaheuristic { get; init; } = LocalSearchMetaheuristic.Types.Value.GuidedLocalSearch;
}
