using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;

namespace Anneal.Jobs;

/// <summary>A request resolved against its job: the instance under the chosen objective, the solvers and their options.</summary>
/// <param name="Seconds">The budget asked for (the solvers' own may be shorter, see <see cref="WallClockBudget"/>).</param>
/// <param name="Notes">What the run should say as a whole: solvers left out of the defaults, advice, the budget kept for writing.</param>
public sealed record JobPlan(LoadedInput Input, Instance Instance, IReadOnlyList<ISolver> Solvers, SolveOptions Options, double Seconds, IReadOnlyList<string> Notes)
{
    /// <summary>The started day reduced to what is left to plan (then <see cref="Instance"/> is its residual instance); null when the run does not re-plan.</summary>
    public Core.Replanning.ResidualDay? Replan { get; init; }

    public int Seed => Options.Seed;

    public IReadOnlyList<string> SolverNames => Solvers.Select(s => s.Name).ToList();
}

/// <summary>A finished run: its plan and every solver's judged result.</summary>
public sealed record JobRun(JobPlan Plan, RunOutcome Outcome)
{
    public LoadedInput Input => Plan.Input;

    public Instance Instance => Plan.Instance;

    public bool Interrupted => Outcome.Interrupted;
}
