namespace Anneal.Formats;

/// <summary>Why a file or folder could not be read or written, in a plain sentence rather than the runtime's wording.</summary>
public static class FileTrouble
{
    /// <summary>Why <paramref name="path"/> could not be read, e.g. "there is no such file".</summary>
    public static string Reading(string path, Exception e) => e switch
    {
        _ when Directory.Exists(path) => "this is a folder, not a file",
        FileNotFoundException or DirectoryNotFoundException => "there is no such file",
        UnauthorizedAccessException => "permission to read it is denied",
        PathTooLongException => "the path is too long",
        ArgumentException or NotSupportedException => "the path is not a valid file name",
        _ => "it cannot be read: " + e.Message,
    };

    /// <summary>Why <paramref name="path"/> could not be written or created, e.g. "permission to write there is denied".</summary>
    public static string Writing(string path, Exception e)
    {
        if (e is UnauthorizedAccessException)
        {
            return "permission to write there is denied";
        }

        if (Output.DiskFull.Is(e))
        {
            return "the disk is full (no space left on the device); free some space, or write elsewhere (--out)";
        }

        if (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            return "the path is not a valid name";
        }

        for (var p = Path.GetFullPath(path); !string.IsNullOrEmpty(p); p = Path.GetDirectoryName(p))
        {
            if (File.Exists(p))
            {
                return p == Path.GetFullPath(path) ? "a file of that name is in the way" : $"{p} is a file, not a folder";
            }
        }

        return e switch
        {
            DirectoryNotFoundException => "its folder does not exist",
            FileNotFoundException => "the file system there does not allow it",
            _ => "the system refused: " + e.Message,
        };
    }
}
