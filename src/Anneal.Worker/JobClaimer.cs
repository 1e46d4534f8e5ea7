using Anneal.Worker.Arrival;

namespace Anneal.Worker;

/// <summary>Takes jobs from the inbox by renaming them into this worker's folder, and hands them back.</summary>
public sealed class JobClaimer(WorkerFolders folders, string workerFolder, SettleWatch settle, TimeProvider clock)
{
    /// <summary>True while the inbox holds anything that is or will become a job (settled or still arriving).</summary>
    public bool InboxHasJobs()
    {
        foreach (var path in Directory.EnumerateFileSystemEntries(folders.Inbox))
        {
            if (!Entries.IsHidden(Path.GetFileName(path)))
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>Claims the oldest settled entry; null when there is none this worker could win.</summary>
    public ClaimedJob? TryClaimNext()
    {
        var now = clock.GetUtcNow();
        foreach (var candidate in Settled())
        {
            bool isFolder = candidate is DirectoryInfo;
            var entry = JobEntry.Parse(candidate.Name, isFolder);
            string target = Path.Combine(workerFolder, candidate.Name);
            try
            {
                Entries.Move(candidate.FullName, target, isFolder, claim: true);
                return new ClaimedJob(entry, target, now);
            }
            catch (IOException)
            {
                // Another worker renamed it first (or it was taken away): try the next one.
            }
        }

        return null;
    }

    /// <summary>Puts an entry back in the inbox under <paramref name="entry"/>'s name (a free variant if a new job took it).</summary>
    public string Return(string path, JobEntry entry)
    {
        var named = entry;
        for (int n = 2; Entries.Exists(Path.Combine(folders.Inbox, named.Name)); n++)
        {
            named = entry with { Job = $"{entry.Job}-{n}" };
        }

        string target = Path.Combine(folders.Inbox, named.Name);
        Entries.Move(path, target, entry.IsFolder);
        return target;
    }

    private List<FileSystemInfo> Settled()
    {
        var candidates = new List<FileSystemInfo>();
        foreach (var info in new DirectoryInfo(folders.Inbox).EnumerateFileSystemInfos())
        {
            if (!Entries.IsHidden(info.Name))
            {
                candidates.Add(info);
            }
        }

        var list = settle.Settled(candidates);

        // Oldest first, so a job dropped early in the evening is not starved by later ones.
        list.Sort((a, b) => a.LastWriteTimeUtc != b.LastWriteTimeUtc ? a.LastWriteTimeUtc.CompareTo(b.LastWriteTimeUtc) : string.CompareOrdinal(a.Name, b.Name));
        return list;
    }
}
