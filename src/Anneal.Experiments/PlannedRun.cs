using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Experiments;

/// <summary>One run of an experiment plan: a solver on an instance (under the experiment's objective) with a seed and a budget.</summary>
public sealed record PlannedRun(LoadedInput Input, Instance Instance, string Solver, int Seed, double BudgetSeconds)
{
    public string Objective => Instance.Objective.ToText();
}
