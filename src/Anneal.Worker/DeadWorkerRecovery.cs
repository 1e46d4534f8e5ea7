using Microsoft.Extensions.Logging;

namespace Anneal.Worker;

/// <summary>
/// Returns the jobs of workers that died to the inbox, one retry more, or to failed/ once their retries are spent.
/// A worker is dead exactly when its lock in working/ can be taken (see <see cref="WorkerLock"/>); a live worker's
/// folder is never touched. Several workers may recover at once: the lock and the renames let only one act.
/// </summary>
public sealed class DeadWorkerRecovery(WorkerFolders folders, string selfId, JobClaimer claimer, int maxRetries, ILogger log, TimeProvider clock)
{
    private static readonly TimeSpan StatusKept = TimeSpan.FromDays(1);

    /// <returns>How many jobs were handed on (requeued, failed or found already published).</returns>
    public int Run()
    {
        int handled = 0;
        foreach (var dir in Directory.GetDirectories(folders.Working))
        {
            string id = Path.GetFileName(dir);
            if (Entries.IsHidden(id) || id == selfId)
            {
                continue;
            }

            string lockPath = WorkerLock.PathFor(folders.Working, id);
            WorkerLock? held = null;

            // No lock file at all: a live worker takes its lock before it makes its folder, so the owner is gone.
            if (File.Exists(lockPath) && (held = WorkerLock.TryTake(lockPath)) is null)
            {
                continue;
            }

            using (held)
            {
                handled += Recover(id, dir);
            }
        }

        foreach (var lockPath in Directory.GetFiles(folders.Working, "*" + WorkerLock.Extension))
        {
            // A lock without a folder: a worker that died before making its folder or after removing it.
            string id = Path.GetFileName(lockPath)[..^WorkerLock.Extension.Length];
            if (id != selfId && !Directory.Exists(Path.Combine(folders.Working, id)))
            {
                using var held = WorkerLock.TryTake(lockPath);
                if (held is not null)
                {
                    Entries.TryDelete(StatusFile.PathFor(folders.Working, id));
                }
            }
        }

        DropOldStatusFiles();
        return handled;
    }

    /// <summary>A stopped worker's last status stays readable for a day, then goes, so restarts do not pile files up.</summary>
    private void DropOldStatusFiles()
    {
        var cutoff = clock.GetUtcNow() - StatusKept;
        foreach (var path in Directory.GetFiles(folders.Working, "*" + StatusFile.Extension))
        {
            string id = Path.GetFileName(path)[..^StatusFile.Extension.Length];
            if (!File.Exists(WorkerLock.PathFor(folders.Working, id)) && File.GetLastWriteTimeUtc(path) < cutoff)
            {
                Entries.TryDelete(path);
            }
        }
    }

    private int Recover(string deadId, string dir)
    {
        int handled = 0;
        foreach (var path in Directory.GetFileSystemEntries(dir))
        {
            string name = Path.GetFileName(path);
            if (Entries.IsHidden(name))
            {
                Entries.TryDelete(path);
                continue;
            }

            var entry = JobEntry.Parse(name, Directory.Exists(path));
            handled++;
            if (PublishedBy(deadId, name, entry.Job) is { } published)
            {
                // Its worker died between publishing the result and deleting the input.
                Entries.Delete(path);
                WorkerLog.DeadWorkerJobPublished(log, entry.Job, deadId, published);
            }
            else if (entry.Retries >= maxRetries)
            {
                var job = new ClaimedJob(entry, path, clock.GetUtcNow());
                string failed = FailedJobs.Move(folders, selfId, job, $"Job '{entry.Job}' was given up after {entry.Retries + 1} attempts.",
                    [$"Each time the worker solving it stopped without finishing (the last one was {deadId}).",
                     "A worker that is killed or runs out of memory on this job every time points at the job's size or at the machine; try it alone with `anneal solve`."]);
                WorkerLog.DeadWorkerJobGivenUp(log, entry.Job, deadId, entry.Retries + 1, failed);
            }
            else
            {
                string back = claimer.Return(path, entry.WithRetries(entry.Retries + 1));
                WorkerLog.DeadWorkerJobRequeued(log, entry.Job, deadId, Path.GetFileName(back), entry.Retries + 1, maxRetries);
            }
        }

        CleanPartials(deadId);
        Entries.TryDelete(StatusFile.PathFor(folders.Working, deadId));
        try
        {
            Directory.Delete(dir);
        }
        catch (IOException)
        {
            // Not empty after all; the next pass looks again.
        }

        return handled;
    }

    /// <summary>The outbox folder a dead worker published from this very claim as a final result, if any.</summary>
    private string? PublishedBy(string deadId, string input, string job)
    {
        foreach (var folder in Directory.GetDirectories(folders.Outbox))
        {
            if (Path.GetFileName(folder).StartsWith(job, StringComparison.Ordinal)
                && JobRecord.TryRead(folder) is { Final: true } record && record.Worker == deadId && record.Input == input)
            {
                return folder;
            }
        }

        return null;
    }

    /// <summary>Unfinished outbox folders are dropped (the job is solved again); a failed/ one that holds its input only needs its rename.</summary>
    private void CleanPartials(string deadId)
    {
        string prefix = Publisher.PartialPrefixOf(deadId);
        foreach (var partial in Directory.GetDirectories(folders.Outbox, prefix + "*"))
        {
            Entries.TryDelete(partial);
        }

        foreach (var partial in Directory.GetDirectories(folders.Failed, prefix + "*"))
        {
            string name = Path.GetFileName(partial);
            bool holdsInput = Directory.GetFileSystemEntries(partial).Any(e => !Path.GetFileName(e).StartsWith(FailedJobs.ErrorFile, StringComparison.Ordinal));
            if (holdsInput && name.Length > prefix.Length + 9)
            {
                Publisher.Publish(partial, folders.Failed, name[prefix.Length..^9], selfId);
            }
            else
            {
                Entries.TryDelete(partial);
            }
        }
    }
}
