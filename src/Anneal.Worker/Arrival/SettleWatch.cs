namespace Anneal.Worker.Arrival;

/// <summary>
/// Decides when an inbox entry has finished arriving. An entry is settled when every file and folder in it (hidden
/// ones included, such as rsync's <c>.name.XXXXXX</c> temporaries) has kept its size and modification time for the
/// settle time, and no process holds one of its files open for writing (<see cref="OpenWriters"/>, where the platform
/// tells). A folder holding <see cref="ReadyMarker"/> is settled once no file in it is open for writing, without
/// waiting. Copying into the inbox with <c>cp -r</c>, <c>scp -r</c> or <c>rsync</c> is therefore safe.
/// </summary>
public sealed class SettleWatch(string inbox, TimeSpan settle, bool requireMarker, TimeProvider clock)
{
    private readonly string _realInbox = OpenWriters.RealPath(inbox) + Path.DirectorySeparatorChar;

    /// <summary>A file a tool writes last into a job folder to say "complete" (hidden, so readers never see it as data).</summary>
    public const string ReadyMarker = ".ready";

    private readonly Dictionary<string, (EntryFingerprint Print, DateTimeOffset StableSince)> _seen = new(StringComparer.Ordinal);

    /// <summary>The settled entries among <paramref name="candidates"/>; forgets entries that left the inbox.</summary>
    public List<FileSystemInfo> Settled(IReadOnlyList<FileSystemInfo> candidates)
    {
        var now = clock.GetUtcNow();
        var timeSettled = new List<(FileSystemInfo Info, EntryFingerprint Print)>();
        var present = new HashSet<string>(StringComparer.Ordinal);
        foreach (var info in candidates)
        {
            present.Add(info.FullName);
            EntryFingerprint print;
            try
            {
                print = EntryFingerprint.Take(info);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                continue; // vanished or changing while read: look again next time
            }

            bool marked = print.HasReadyMarker;
            if (requireMarker && info is DirectoryInfo && !marked)
            {
                continue;
            }

            var stableSince = Stable(info.FullName, print, now);
            if (marked || now - stableSince >= settle)
            {
                timeSettled.Add((info, print));
            }
        }

        foreach (var gone in _seen.Keys.Where(k => !present.Contains(k)).ToList())
        {
            _seen.Remove(gone);
        }

        if (timeSettled.Count == 0)
        {
            return [];
        }

        var writing = OpenWriters.Find(_realInbox);
        var settled = new List<FileSystemInfo>();
        foreach (var (info, print) in timeSettled)
        {
            if (writing is null || !print.AnyOpenIn(writing, info.FullName, _realInbox))
            {
                settled.Add(info);
            }
        }

        return settled;
    }

    /// <summary>
    /// Since when the entry has looked as it does now: at first sight its newest time stamp (its files say they have
    /// not changed since), and the moment of the last change this watch saw after that.
    /// </summary>
    private DateTimeOffset Stable(string path, EntryFingerprint print, DateTimeOffset now)
    {
        if (_seen.TryGetValue(path, out var known) && known.Print.Equals(print))
        {
            return known.StableSince;
        }

        var since = known.Print is null ? (print.Newest < now ? print.Newest : now) : now;
        _seen[path] = (print, since);
        return since;
    }
}
