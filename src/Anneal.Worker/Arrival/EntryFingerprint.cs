namespace Anneal.Worker.Arrival;

/// <summary>
/// What an inbox entry looks like now: every file and folder in it (hidden ones included), each with its size and
/// modification time, read without following links. Two equal fingerprints taken apart in time mean nothing in the
/// entry changed in between.
/// </summary>
public sealed class EntryFingerprint : IEquatable<EntryFingerprint>
{
    /// <summary>Items described one by one; a job has a handful of files, and a hostile tree must not make a scan slow.</summary>
    private const int MaxItems = 2_000;

    private readonly List<(string Path, long Length, long Ticks)> _items = [];
    private int _count;

    /// <summary>The newest modification time among the entry and everything in it.</summary>
    public DateTimeOffset Newest { get; private set; } = DateTimeOffset.MinValue;

    /// <summary>The entry is a folder holding <see cref="SettleWatch.ReadyMarker"/> at its top.</summary>
    public bool HasReadyMarker { get; private set; }

    /// <exception cref="IOException">when the entry changes or vanishes while it is read.</exception>
    public static EntryFingerprint Take(FileSystemInfo entry)
    {
        var print = new EntryFingerprint();
        entry.Refresh();
        print.Add(entry);
        if (entry is DirectoryInfo folder && entry.LinkTarget is null)
        {
            print.HasReadyMarker = File.Exists(Path.Combine(folder.FullName, SettleWatch.ReadyMarker));
            var options = new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0, IgnoreInaccessible = false, ReturnSpecialDirectories = false };
            foreach (var item in folder.EnumerateFileSystemInfos("*", options))
            {
                print.Add(item);
            }
        }

        print._items.Sort((a, b) => string.CompareOrdinal(a.Path, b.Path));
        return print;
    }

    /// <summary>True when a file of this entry is among <paramref name="openForWriting"/> (real paths under <paramref name="realInbox"/>).</summary>
    public bool AnyOpenIn(IReadOnlySet<string> openForWriting, string entryPath, string realInbox)
    {
        // The entry's own paths start with the inbox as configured; /proc names it by its real path.
        string configured = Path.GetDirectoryName(entryPath)! + Path.DirectorySeparatorChar;
        foreach (var item in _items)
        {
            string real = item.Path.StartsWith(configured, StringComparison.Ordinal) ? realInbox + item.Path[configured.Length..] : item.Path;
            if (openForWriting.Contains(real))
            {
                return true;
            }
        }

        return false;
    }

    public bool Equals(EntryFingerprint? other)
    {
        if (other is null || other._count != _count || other._items.Count != _items.Count)
        {
            return false;
        }

        for (int i = 0; i < _items.Count; i++)
        {
            if (_items[i] != other._items[i])
            {
                return false;
            }
        }

        return true;
    }

    public override bool Equals(object? obj) => Equals(obj as EntryFingerprint);

    public override int GetHashCode() => HashCode.Combine(_count, Newest);

    private void Add(FileSystemInfo item)
    {
        _count++;
        var time = item.LastWriteTimeUtc;
        if (time > Newest)
        {
            Newest = time;
        }

        if (_items.Count < MaxItems)
        {
            long length = item is FileInfo file && item.LinkTarget is null ? file.Length : -1;
            _items.Add((item.FullName, length, time.Ticks));
        }
    }
}
