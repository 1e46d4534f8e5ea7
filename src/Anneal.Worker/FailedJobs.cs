using Anneal.Formats.Output;

namespace Anneal.Worker;

/// <summary>Moves a job that cannot be solved to failed/&lt;job&gt;/, with its input as given and error.txt saying why.</summary>
public static class FailedJobs
{
    public const string ErrorFile = "error.txt";

    /// <param name="lines">The reasons, one per line (for bad input: one problem per line, as `anneal check` prints them).</param>
    /// <returns>The failed job's folder.</returns>
    public static string Move(WorkerFolders folders, string workerId, ClaimedJob job, string headline, IReadOnlyList<string> lines)
    {
        string partial = Publisher.NewPartial(folders.Failed, workerId, job.Id);
        AtomicFile.WriteText(Path.Combine(partial, ErrorFile), w =>
        {
            w.WriteLine(headline);
            foreach (var line in lines)
            {
                w.WriteLine(line);
            }

            w.WriteLine();
            w.WriteLine($"The input is kept beside this file as {job.Entry.OriginalName}; after fixing it, move it back into the inbox.");
        });

        // The input goes last: a partial folder that holds it is complete and recovery only needs to finish the rename.
        Entries.Move(job.Path, Path.Combine(partial, job.Entry.OriginalName), job.Entry.IsFolder);
        return Publisher.Publish(partial, folders.Failed, job.Id, workerId);
    }
}
