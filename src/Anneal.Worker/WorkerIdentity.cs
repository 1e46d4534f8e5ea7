using System.Globalization;

namespace Anneal.Worker;

/// <summary>Who this worker is: a name no other process will ever use, its lock and its own folder under working/.</summary>
public sealed class WorkerIdentity : IDisposable
{
    private readonly WorkerLock _lock;

    private WorkerIdentity(string id, string folder, WorkerLock held)
    {
        Id = id;
        Folder = folder;
        _lock = held;
    }

    /// <summary>host-pid-random: readable in logs, unique even when a pid is reused or two machines share the folders.</summary>
    public string Id { get; }

    /// <summary>working/&lt;id&gt;/, where this worker's claimed jobs live.</summary>
    public string Folder { get; }

    /// <summary>Takes the lock first, then creates the folder, so a folder without a lock can only belong to a dead worker.</summary>
    public static WorkerIdentity Start(string working, DateTimeOffset now)
    {
        string id = string.Create(CultureInfo.InvariantCulture, $"{Safe(Environment.MachineName)}-{Environment.ProcessId}-{Guid.NewGuid().ToString("N")[..8]}");
        var held = WorkerLock.Create(WorkerLock.PathFor(working, id),
            string.Create(CultureInfo.InvariantCulture, $"worker {id} host {Environment.MachineName} pid {Environment.ProcessId} started {now:O}"));
        string folder = Path.Combine(working, id);
        Directory.CreateDirectory(folder);
        return new WorkerIdentity(id, folder, held);
    }

    /// <summary>Removes the folder when it is empty, then releases the lock (the reverse order of <see cref="Start"/>).</summary>
    public void Dispose()
    {
        try
        {
            if (Directory.Exists(Folder) && !Directory.EnumerateFileSystemEntries(Folder).Any())
            {
                Directory.Delete(Folder);
            }
        }
        catch (IOException)
        {
            // Something arrived meanwhile; recovery by the next worker handles it.
        }

        _lock.Dispose();
    }

    private static string Safe(string name)
    {
        var chars = name.ToCharArray();
        for (int i = 0; i < chars.Length; i++)
        {
            if (!char.IsAsciiLetterOrDigit(chars[i]))
            {
                chars[i] = '_';
            }
        }

        return chars.Length == 0 ? "host" : new string(chars);
    }
}
