using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;

namespace Anneal.Jobs;

/// <summary>A request resolved against its job: the instance under the chosen objective, the solvers and their options.</summary>
public sealed record JobPlan(LoadedInput Input, Instance Instance, IReadOnlyList<ISolver> Solvers, SolveOptions Options)
{
    public double Seconds => Options.TimeLimit.TotalSeconds;

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
