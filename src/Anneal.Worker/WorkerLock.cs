using System.Text;

namespace Anneal.Worker;

/// <summary>
/// working/&lt;worker&gt;.lock, held open with FileShare.None for the worker's whole life. The operating system drops the
/// lock when the process dies, however it dies, so "can another process take this lock?" is exactly "is its worker dead?".
/// On Linux .NET maps FileShare.None to an exclusive flock; shared folders need a file system that honours locks
/// across machines (NFSv4, SMB).
/// </summary>
public sealed class WorkerLock : IDisposable
{
    public const string Extension = ".lock";

    private readonly FileStream _stream;

    private WorkerLock(FileStream stream)
    {
        _stream = stream;
    }

    public static string PathFor(string working, string workerId) => Path.Combine(working, workerId + Extension);

    /// <summary>Creates and takes the lock of a new worker; the file says who holds it, for people reading the folder.</summary>
    public static WorkerLock Create(string path, string owner)
    {
        var stream = new FileStream(path, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, 4096, FileOptions.DeleteOnClose);
        var bytes = Encoding.UTF8.GetBytes(owner + Environment.NewLine);
        stream.Write(bytes);
        stream.Flush(flushToDisk: true);
        return new WorkerLock(stream);
    }

    /// <summary>Takes a dead worker's lock; null while its owner (or another worker cleaning up after it) still holds it, or when it is gone.</summary>
    public static WorkerLock? TryTake(string path)
    {
        try
        {
            var taken = new WorkerLock(new FileStream(path, FileMode.Open, FileAccess.ReadWrite, FileShare.None, 4096, FileOptions.DeleteOnClose));
            if (!File.Exists(path))
            {
                // Its owner stopped cleanly between our open and our lock, deleting the file: what we hold is no
                // dead worker's lock, and acting on it would remove a live record (its status file).
                taken.Dispose();
                return null;
            }

            return taken;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }

    /// <summary>Releases the lock and deletes the file.</summary>
    public void Dispose() => _stream.Dispose();
}
