using Anneal.Core.Evaluation;
using Anneal.Search.Representation;

namespace Anneal.Search.Moves;

/// <summary>
/// A move's effect split by rule: the objective change and the change of each hard-rule violation. Its penalized
/// change under any weights is <see cref="Penalized"/>, so a search whose weights move every iteration can cache these.
/// </summary>
public struct MoveParts
{
    public double Objective;
    public RuleAmounts Violation;

    /// <summary>Change in the number of infeasible routes among the routes the move rebuilds.</summary>
    public int InfeasibleRoutes;

    /// <summary>The move takes the last stops off one of its routes.</summary>
    public bool EmptiesRoute;

    /// <summary>The move puts stops on a route that has none.</summary>
    public bool OpensRoute;

    /// <summary>Feasibility after the move, as computed; stale once other routes change (see SearchState.FeasibleAfter).</summary>
    public bool FeasibleAfter;

    public readonly double Penalized(in PenaltyWeights w) => Objective + Violation.Weighted(w);

    public readonly MoveEffect Effect(in PenaltyWeights w) =>
        new() { Penalized = Penalized(w), Objective = Objective, FeasibleAfter = FeasibleAfter };
}
