namespace Anneal.Search.Moves;

/// <summary>
/// A move's effect split by rule: the objective change and the change of each hard-rule violation. Its penalized
/// change under any weights is <see cref="Penalized"/>, so a search whose weights move every iteration can cache these.
/// </summary>
public struct MoveParts
{
    public double Objective;
    public double TimeWindow;
    public double Capacity;
    public double Overtime;
    public double Duration;
    public double Skill;
    public double Unserved;

    /// <summary>Change in the number of infeasible routes among the routes the move rebuilds.</summary>
    public int InfeasibleRoutes;

    /// <summary>Feasibility after the move, as computed; stale once other routes change (see SearchState.FeasibleAfter).</summary>
    public bool FeasibleAfter;

    public readonly double Penalized(in Core.Evaluation.PenaltyWeights w) =>
        Objective + (TimeWindow * w.TimeWindow) + (Capacity * w.Capacity) + (Overtime * w.Overtime)
        + (Duration * w.Duration) + (Skill * w.Skill) + (Unserved * w.Unserved);

    public readonly MoveEffect Effect(in Core.Evaluation.PenaltyWeights w) =>
        new() { Penalized = Penalized(w), Objective = Objective, FeasibleAfter = FeasibleAfter };
}
