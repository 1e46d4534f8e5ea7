namespace Anneal.Worker;

/// <summary>File-system steps on job entries, which may be folders or files.</summary>
public static class Entries
{
    /// <summary>True for names the worker never treats as jobs: dot-names are its own temporaries and the way to copy a job in unseen.</summary>
    public static bool IsHidden(string name) => name.Length == 0 || name[0] == '.';

    public static bool Exists(string path) => Directory.Exists(path) || File.Exists(path);

    /// <summary>
    /// One rename. For a claim the target is in this worker's own folder, so files move with overwrite: that is a plain
    /// rename(2), which exactly one of several racing workers wins; without it .NET links then unlinks, and two workers
    /// could both believe they had the file.
    /// </summary>
    public static void Move(string source, string target, bool isFolder, bool claim = false)
    {
        if (isFolder)
        {
            Directory.Move(source, target);
        }
        else
        {
            File.Move(source, target, overwrite: claim);
        }
    }

    public static void Delete(string path)
    {
        if (Directory.Exists(path))
        {
            Directory.Delete(path, recursive: true);
        }
        else
        {
            File.Delete(path);
        }
    }

    /// <summary>Deletes and swallows the failure: used for leftovers whose removal is housekeeping, not correctness.</summary>
    public static void TryDelete(string path)
    {
        try
        {
            Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Left for the next clean-up.
        }
    }

    /// <summary>&lt;folder&gt;/&lt;name&gt;, or &lt;name&gt;-2, -3 … when that is taken.</summary>
    public static string FreeName(string folder, string stem, string extension)
    {
        string path = Path.Combine(folder, stem + extension);
        for (int n = 2; Exists(path); n++)
        {
            path = Path.Combine(folder, $"{stem}-{n}{extension}");
        }

        return path;
    }
}
