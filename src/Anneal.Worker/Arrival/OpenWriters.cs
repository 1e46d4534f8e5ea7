namespace Anneal.Worker.Arrival;

/// <summary>
/// The files some process holds open for writing, read from Linux's <c>/proc/&lt;pid&gt;/fd</c> and
/// <c>/proc/&lt;pid&gt;/fdinfo</c>. A copier such as <c>cp</c> or <c>scp</c> keeps the file it writes open until it is
/// complete, so a job with such a file is still arriving however long it has been quiet (a stalled network copy).
/// Only processes this user may inspect are seen (all of them for root); elsewhere, and on other platforms, the
/// settle time alone decides.
/// </summary>
public static class OpenWriters
{
    private const string Proc = "/proc";

    // O_WRONLY and O_RDWR in the octal "flags:" line of fdinfo.
    private const int WriteAccess = 0b11;

    /// <summary>Full paths under <paramref name="folder"/> open for writing by any process; null when the platform does not tell.</summary>
    public static IReadOnlySet<string>? Find(string folder)
    {
        if (!OperatingSystem.IsLinux() || !Directory.Exists(Proc))
        {
            return null;
        }

        var open = new HashSet<string>(StringComparer.Ordinal);
        IEnumerable<string> processes;
        try
        {
            processes = Directory.EnumerateDirectories(Proc);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }

        foreach (var process in processes)
        {
            string name = Path.GetFileName(process);
            if (name.Length == 0 || !char.IsAsciiDigit(name[0]))
            {
                continue;
            }

            AddWriters(process, folder, open);
        }

        return open;
    }

    /// <summary>
    /// The path as /proc names it: symbolic links in any of its components resolved, so that the inbox given as a
    /// link (e.g. /srv/inbox pointing elsewhere) still matches the targets of open file descriptors.
    /// </summary>
    public static string RealPath(string path)
    {
        string full = Path.GetFullPath(path);
        string resolved = Path.GetPathRoot(full) ?? "/";
        foreach (var part in full[resolved.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries))
        {
            resolved = Path.Combine(resolved, part);
            try
            {
                if (new DirectoryInfo(resolved).ResolveLinkTarget(returnFinalTarget: true) is { } target)
                {
                    resolved = target.FullName;
                }
            }
            catch (IOException)
            {
                // a broken link or a missing part: keep the path as written
            }
        }

        return resolved;
    }

    private static void AddWriters(string process, string folder, HashSet<string> open)
    {
        try
        {
            foreach (var fd in Directory.EnumerateFileSystemEntries(Path.Combine(process, "fd")))
            {
                string? target = new FileInfo(fd).LinkTarget;
                if (target is null || !target.StartsWith(folder, StringComparison.Ordinal) || open.Contains(target))
                {
                    continue; // elsewhere, or a socket, pipe or anonymous file (no path)
                }

                if (IsWriting(Path.Combine(process, "fdinfo", Path.GetFileName(fd))))
                {
                    open.Add(target);
                }
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The process ended while it was read, or belongs to another user: nothing to see there.
        }
    }

    private static bool IsWriting(string fdinfo)
    {
        foreach (var line in File.ReadLines(fdinfo))
        {
            if (line.StartsWith("flags:", StringComparison.Ordinal))
            {
                var octal = line.AsSpan(6).Trim();
                int flags = 0;
                foreach (char c in octal)
                {
                    flags = (flags * 8) + (c - '0');
                }

                return (flags & WriteAccess) != 0;
            }
        }

        return false;
    }
}
