using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Formats.Output.Artifacts;

namespace Anneal.Jobs;

/// <summary>Writes a run's files into its folder through the host's artifact writers, in the order they were registered.</summary>
public sealed class RunWriter(IEnumerable<IRunArtifact> artifacts)
{
    private readonly List<IRunArtifact> _artifacts = [.. artifacts];

    /// <summary>The chosen plan of a finished run.</summary>
    public void Write(string folder, JobRun run, DateTimeOffset generatedAt)
    {
        var facts = new RunFacts(run.Plan.Seed, run.Plan.Seconds, run.Interrupted, generatedAt);
        Write(folder, run.Input, run.Instance, run.Outcome.Best.Evaluation, run.Outcome, facts);
    }

    /// <param name="outcome">Null for a plan judged without a search (`evaluate`).</param>
    public void Write(string folder, LoadedInput input, Instance instance, PlanEvaluation plan, RunOutcome? outcome, RunFacts facts)
    {
        var context = new RunContext(folder, input, instance, plan, outcome, RunSummary.For(input, instance, plan, outcome, facts));
        foreach (var artifact in _artifacts)
        {
            artifact.Write(context);
        }
    }
}
