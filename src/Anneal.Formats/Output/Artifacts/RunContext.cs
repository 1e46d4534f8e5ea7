using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;

namespace Anneal.Formats.Output.Artifacts;

/// <summary>What the artifact writers of one run see.</summary>
/// <param name="Instance">The instance under the objective the run used (the input's may differ).</param>
/// <param name="Plan">The written plan, as the evaluator judged it.</param>
/// <param name="Outcome">Every solver's result; null for `evaluate`, which judges a given plan.</param>
public sealed record RunContext(string Folder, LoadedInput Input, Instance Instance, PlanEvaluation Plan, RunOutcome? Outcome, SummaryDocument Summary)
{
    /// <summary>In a re-plan: the day reduced to what was left to plan (<see cref="Instance"/> is its residual instance); null otherwise.</summary>
    public Core.Replanning.ResidualDay? Replan { get; init; }

    /// <summary>In a re-plan: every stop changed against the given plan; null otherwise.</summary>
    public Core.Replanning.DayChanges? Changes { get; init; }

    public string PathOf(string fileName) => System.IO.Path.Combine(Folder, fileName);
}

/// <summary>What the summary says about the run besides the plan.</summary>
public sealed record RunFacts(int? Seed, double? TimeLimitSeconds, bool Interrupted, DateTimeOffset GeneratedAt);
