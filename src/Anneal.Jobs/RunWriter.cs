using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Replanning;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Formats.Output.Artifacts;

namespace Anneal.Jobs;

/// <summary>
/// Writes a run's files into its folder through the host's artifact writers, in the order they were registered: all of
/// them or none. They are written into a hidden folder inside it first and moved up only when every one is complete,
/// so a full disk (or any write failure) midway leaves the folder as it was, not a plan without its summary.
/// </summary>
public sealed class RunWriter(IEnumerable<IRunArtifact> artifacts)
{
    private readonly List<IRunArtifact> _artifacts = [.. artifacts];

    /// <summary>The chosen plan of a finished run.</summary>
    /// <returns>summary.json's document as written.</returns>
    public SummaryDocument Write(string folder, JobRun run, DateTimeOffset generatedAt)
    {
        var facts = new RunFacts(run.Plan.Seed, run.Plan.Seconds, run.Interrupted, generatedAt);
        return Write(folder, run.Input, run.Instance, run.Outcome.Best.Evaluation, run.Outcome, facts, run.Plan.Replan);
    }

    /// <param name="outcome">Null for a plan judged without a search (`evaluate`).</param>
    /// <param name="replan">The residual day of a re-plan (then <paramref name="instance"/> is its residual instance); null otherwise.</param>
    public SummaryDocument Write(string folder, LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts, ResidualDay? replan = null)
    {
        var summary = RunSummary.For(input, instance, plan, outcome, facts);
        var changes = replan is null ? null : DayChanges.Compute(replan, plan);
        if (replan is not null && changes is not null)
        {
            summary = summary with { Changes = Describe(replan, changes) };
        }

        string staging = Path.Combine(folder, $".writing-{Guid.NewGuid():N}");
        try
        {
            Directory.CreateDirectory(staging);
            var context = new RunContext(staging, input, instance, plan, outcome, summary) { Replan = replan, Changes = changes };
            foreach (var artifact in _artifacts)
            {
                artifact.Write(context);
            }

            // Renames within one folder need no space; only now does any file of this run appear.
            foreach (var file in Directory.GetFiles(staging))
            {
                File.Move(file, Path.Combine(folder, Path.GetFileName(file)), overwrite: true);
            }

            return context.Summary;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or OutputException)
        {
            throw OutputException.NothingKept(e as OutputException ?? OutputException.For(folder, e), folder, staging);
        }
        finally
        {
            try
            {
                Directory.Delete(staging, recursive: true);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // Nothing was created, or the original error matters more than a leftover hidden folder.
            }
        }
    }

    public static ChangesSummary Describe(ResidualDay replan, DayChanges changes)
    {
        var job = replan.Day;
        var without = replan.Fixed.Where(f => f.TakenOut).Select(f => job.Vehicles[f.Vehicle].Id).ToList();
        return new ChangesSummary(replan.Request.Now is double now ? job.Units.Format(now) : null, without, replan.Fixed.Sum(f => f.Visits.Count),
            changes.Added, changes.Cancelled, changes.Moved, changes.Retimed, changes.Summary(job.Units.TimeWords));
    }
}
