using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;

namespace Anneal.Formats.Output.Artifacts;

/// <summary>summary.json's document for a run: the plan's verdict, every solver's judged result, the run's facts.</summary>
public static class RunSummary
{
    public static SummaryDocument For(LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        var solvers = new List<SolverSummary>();
        double? lowerBound = null;
        foreach (var judged in outcome?.Results ?? [])
        {
            var r = judged.Result;
            var e = judged.Evaluation;
            solvers.Add(new SolverSummary(r.Solver, e.Objective, e.Distance, e.VehiclesUsed, e.Feasible, r.SecondsToBest, r.Seconds, r.Status.ToText(), r.LowerBound, r.Notes ?? [], r.BoundOnly));
            if (r.LowerBound is { } b && double.IsFinite(b) && (lowerBound is null || b > lowerBound))
            {
                lowerBound = b;
            }
        }

        return new SummaryDocument(
            instance.Name,
            input.Format,
            instance.Objective.ToText(),
            SummaryJsonWriter.Describe(instance, plan),
            solvers,
            outcome?.Best.Result.Solver,
            facts.Seed,
            facts.TimeLimitSeconds,
            facts.Interrupted,
            Cautions.All,
            facts.GeneratedAt,
            lowerBound);
    }
}
