using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Reports;
using Anneal.Reports.Runs;
using Anneal.Search.Running;

namespace Anneal.Jobs;

/// <summary>
/// Writes a run's files into its output folder: routes.csv, summary.json, (after a search) trace.csv, run.json (what
/// `anneal plot` needs to redraw), then the pictures and report.html drawn from those files.
/// </summary>
public static class RunFiles
{
    /// <summary>What the summary says about the run besides the plan.</summary>
    public sealed record RunFacts(int? Seed, double? TimeLimitSeconds, bool Interrupted, DateTimeOffset GeneratedAt);

    public static void Write(string folder, LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        RoutesCsvWriter.Write(Path.Combine(folder, RoutesCsvWriter.FileName), instance, plan);
        var summary = Summary(input, instance, plan, outcome, facts);
        SummaryJsonWriter.Write(Path.Combine(folder, SummaryJsonWriter.FileName), summary);
        if (outcome is not null)
        {
            TraceCsvWriter.Write(Path.Combine(folder, TraceCsvWriter.FileName), Trace(outcome));
        }

        RunRecordFile.Write(Path.Combine(folder, RunRecordFile.FileName), Record(input, instance, plan, summary));
        RunReport.Write(folder, instance, plan);
    }

    public static RunRecord Record(LoadedInput input, Instance instance, PlanEvaluation plan, SummaryDocument summary) => new(
        RunRecord.CurrentVersion,
        Path.GetFullPath(input.Path),
        input.Format,
        instance.Objective.ToText(),
        RunRecordFile.Routes(instance, plan),
        summary.Solvers,
        summary.Chosen,
        summary.Seed,
        summary.TimeLimitSeconds,
        summary.Interrupted,
        summary.GeneratedAt);

    public static SummaryDocument Summary(LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        var solvers = new List<SolverSummary>();
        double? lowerBound = null;
        foreach (var judged in outcome?.Results ?? [])
        {
            var r = judged.Result;
            var e = judged.Evaluation;
            solvers.Add(new SolverSummary(r.Solver, e.Objective, e.Distance, e.VehiclesUsed, e.Feasible, r.SecondsToBest, r.Seconds, r.Status, r.LowerBound, r.Notes ?? [], r.BoundOnly));
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
