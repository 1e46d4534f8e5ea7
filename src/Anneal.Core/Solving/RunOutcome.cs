using Anneal.Core.Evaluation;

namespace Anneal.Core.Solving;

/// <summary>A solver's result with the evaluator's verdict on its plan.</summary>
public sealed record JudgedResult(SolverResult Result, PlanEvaluation Evaluation)
{
    /// <summary>The verdict to rank, or null when the solver found no plan.</summary>
    public PlanEvaluation? Ranked => Result.HasPlan ? Evaluation : null;
}

/// <summary>All solvers' results and the plan chosen among them (in <see cref="PlanRanking"/>'s order).</summary>
public sealed record RunOutcome(IReadOnlyList<JudgedResult> Results, int Chosen)
{
    public JudgedResult Best => Results[Chosen];

    /// <summary>True when a stop request cut the run short.</summary>
    public bool Interrupted { get; init; }

    /// <summary>What the run as a whole should say (solvers left out of the defaults, the budget kept for output).</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];
}
