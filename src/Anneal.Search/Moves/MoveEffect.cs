namespace Anneal.Search.Moves;

/// <summary>What a move would change: penalized cost, reported objective, and whether the plan is feasible after it.</summary>
public struct MoveEffect
{
    public double Penalized;
    public double Objective;
    public bool FeasibleAfter;
}
