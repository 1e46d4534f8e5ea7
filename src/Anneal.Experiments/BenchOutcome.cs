namespace Anneal.Experiments;

/// <summary>What a (possibly resumed) benchmark left in results.csv and what this invocation did.</summary>
/// <param name="Rows">Every row of results.csv afterwards: earlier invocations' and this one's.</param>
/// <param name="Plan">The runs the experiment consists of.</param>
/// <param name="Skipped">Planned runs already in results.csv before this invocation.</param>
/// <param name="Finished">Runs this invocation finished and recorded.</param>
/// <param name="Dropped">Runs stopped by cancellation while in flight: not recorded, so a re-run does them again.</param>
public sealed record BenchOutcome(IReadOnlyList<BenchRow> Rows, IReadOnlyList<PlannedRun> Plan, int Skipped, int Finished, int Dropped)
{
    public int Missing => Plan.Count - Skipped - Finished;

    /// <summary>The rows that belong to this plan (results.csv may hold runs of an earlier, larger plan).</summary>
    public IReadOnlyList<BenchRow> PlanRows()
    {
        var keys = new HashSet<RunKey>(Plan.Select(RunKey.Of));
        return Rows.Where(r => keys.Contains(RunKey.Of(r))).ToList();
    }
}
