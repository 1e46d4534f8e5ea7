using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Screening;
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
            bool has = r.HasPlan;
            solvers.Add(new SolverSummary(r.Solver, has ? e.Objective : null, has ? e.Distance : null, has ? e.VehiclesUsed : null, has && e.Feasible,
                r.SecondsToBest, r.Seconds, r.Status.ToText(), r.LowerBound, r.Notes ?? [], r.BoundOnly));
            if (r.LowerBound is { } b && double.IsFinite(b) && (lowerBound is null || b > lowerBound))
            {
                lowerBound = b;
            }
        }

        var screening = new List<ObstacleSummary>();
        foreach (var o in JobScreen.Screen(instance))
        {
            screening.Add(new ObstacleSummary(o.Rule, o.Stop, o.Message));
        }

        return new SummaryDocument(
            instance.Name,
            input.Format,
            instance.Objective.ToText(),
            SummaryJsonWriter.Describe(instance, plan),
            screening,
            solvers,
            outcome is { Best.Result.HasPlan: true } ? outcome.Best.Result.Solver : null,
            facts.Seed,
            facts.TimeLimitSeconds,
            facts.Interrupted,
            Cautions.All,
            facts.GeneratedAt,
            lowerBound,
            outcome?.Notes ?? []);
    }
}
