using Anneal.Formats.Input;

namespace Anneal.Worker.Untrusted;

/// <summary>
/// A job is plain files and folders only. A symbolic link could make the worker read (and quote in error.txt) a file
/// outside the job, such as the password file; a named pipe would block the reader forever; a device or socket is
/// never job data. Such an entry is refused with its name before anything in the job is read.
/// </summary>
public static class PlainFiles
{
    /// <param name="name">The entry's name as the user gave it, for messages.</param>
    /// <exception cref="InputException">naming every entry that is not a plain file or folder.</exception>
    public static void Check(string path, string name)
    {
        var problems = new List<InputProblem>();
        var root = new FileInfo(path);
        if (root.LinkTarget is not null)
        {
            problems.Add(Refused(name, "is a symbolic link"));
        }
        else if (Directory.Exists(path))
        {
            var options = new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0, ReturnSpecialDirectories = false };
            foreach (var item in new DirectoryInfo(path).EnumerateFileSystemInfos("*", options))
            {
                if (Kind(item) is { } kind && problems.Count < 20)
                {
                    problems.Add(Refused(Path.Combine(name, Path.GetRelativePath(path, item.FullName)), kind));
                }
            }
        }
        else if (Kind(root) is { } kind)
        {
            problems.Add(Refused(name, kind));
        }

        if (problems.Count > 0)
        {
            throw new InputException(problems);
        }
    }

    /// <summary>Null for a plain file or folder; else what it is, in words.</summary>
    private static string? Kind(FileSystemInfo item)
    {
        if (item.LinkTarget is not null || item.Attributes.HasFlag(FileAttributes.ReparsePoint))
        {
            return "is a symbolic link";
        }

        if (item is DirectoryInfo || item.Attributes.HasFlag(FileAttributes.Directory))
        {
            return null;
        }

        return FileKind.IsPlain(item.FullName) == false ? "is not a regular file (a pipe, socket or device)" : null;
    }

    private static InputProblem Refused(string name, string kind) =>
        new(name, null, null, null, $"{kind}; a job is plain files only",
            "copy the files themselves into the job (not links to them), then drop the job again");
}
