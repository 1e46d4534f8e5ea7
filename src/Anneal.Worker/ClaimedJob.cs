namespace Anneal.Worker;

/// <summary>A job this worker owns: its entry, now at <paramref name="Path"/> under working/&lt;worker&gt;/.</summary>
public sealed record ClaimedJob(JobEntry Entry, string Path, DateTimeOffset ClaimedAt)
{
    public string Id => Entry.Job;

    public int Attempt => Entry.Retries + 1;
}
