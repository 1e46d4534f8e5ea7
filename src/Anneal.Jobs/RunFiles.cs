using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Search.Running;

namespace Anneal.Jobs;

/// <summary>Writes a run's files into its output folder: routes.csv, summary.json and (after a search) trace.csv.</summary>
public static class RunFiles
{
    /// <summary>What the summary says about the run besides the plan.</summary>
    public sealed record RunFacts(int? Seed, double? TimeLimitSeconds, bool Interrupted, DateTimeOffset GeneratedAt);

    public static void Write(string folder, LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        RoutesCsvWriter.Write(Path.Combine(folder, RoutesCsvWriter.FileName), instance, plan);
        SummaryJsonWriter.Write(Path.Combine(folder, SummaryJsonWriter.FileName), Summary(input, instance, plan, outcome, facts));
        if (outcome is not null)
        {
            TraceCsvWriter.Write(Path.Combine(folder, TraceCsvWriter.FileName), Trace(outcome));
        }
    }

    public static SummaryDocument Summary(LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        var solvers = new List<SolverSummary>();
        foreach (var judged in outcome?.Results ?? [])
        {
            var r = judged.Result;
            var e = judged.Evaluation;
            solvers.Add(new SolverSummary(r.Solver, e.Objective, e.Distance, e.VehiclesUsed, e.Feasible, r.SecondsToBest, r.Seconds, r.Status, r.LowerBound, r.Notes ?? []));
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
            facts.GeneratedAt);
    }

    private static IEnumerable<TraceRow> Trace(RunOutcome outcome)
    {
        foreach (var judged in outcome.Results)
        {
            foreach (var p in judged.Result.Trace)
            {
                yield return new TraceRow(judged.Result.Solver, p.Seconds, p.Iteration, p.BestObjective, p.CurrentObjective, p.BestFeasible, p.State);
            }
        }
    }
}
