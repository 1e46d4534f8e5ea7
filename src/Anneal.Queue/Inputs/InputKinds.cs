using Anneal.Formats.Input;

namespace Anneal.Queue.Inputs;

/// <summary>The kinds of input a job may be, in the order they are tried.</summary>
public static class InputKinds
{
    /// <summary>Largest input stored for one job; a day's deliveries are far smaller, and a table row stays reasonable.</summary>
    public const long MaxBytes = 64L * 1024 * 1024;

    public static IReadOnlyList<IInputKind> All { get; } = [new FolderInput(), new ZipInput(), new FileInput()];

    /// <exception cref="InputException">when no kind takes the path (it does not exist).</exception>
    public static IInputKind For(string path)
    {
        foreach (var kind in All)
        {
            if (kind.Accepts(path))
            {
                return kind;
            }
        }

        throw new InputException(new InputProblem(path, null, null, null, "no such file or folder",
            "give a CSV job folder, a .zip of one, or a Solomon .txt / CVRPLIB .vrp file"));
    }

    /// <exception cref="InputException">when the job's kind is not one this build knows.</exception>
    public static IInputKind Named(string name)
    {
        foreach (var kind in All)
        {
            if (kind.Name == name)
            {
                return kind;
            }
        }

        throw new InputException(new InputProblem("job", null, "kind", name, "this kind of input is not known to this anneal", "run the job with the anneal release that submitted it"));
    }

    /// <summary>The job's name: a folder's name, a file's name without its extension.</summary>
    public static string JobName(string path)
    {
        string trimmed = Path.TrimEndingDirectorySeparator(Path.GetFullPath(path));
        return Directory.Exists(trimmed) ? Path.GetFileName(trimmed) : Path.GetFileNameWithoutExtension(trimmed);
    }

    internal static byte[] Read(string path, string shown, ref long total)
    {
        try
        {
            var bytes = File.ReadAllBytes(path);
            total += bytes.LongLength;
            if (total > MaxBytes)
            {
                throw new InputException(new InputProblem(shown, null, null, null, $"the job is larger than {MaxBytes / (1024 * 1024)} MB",
                    "submit only the job's files (stops.csv, depots.csv, vehicles.csv, matrix.csv, settings.json)"));
            }

            return bytes;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException(new InputProblem(shown, null, null, null, "the file cannot be read: " + e.Message, "check the path and its permissions"));
        }
    }

    /// <summary>Writes one stored file below <paramref name="root"/>, refusing paths that would leave it.</summary>
    internal static void Write(string root, StoredFile file)
    {
        string full = Path.GetFullPath(Path.Combine(root, file.Path));
        if (!full.StartsWith(Path.GetFullPath(root) + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            throw new InputException(new InputProblem(file.Path, null, null, null, "a stored path points outside the job", "submit the job again"));
        }

        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        File.WriteAllBytes(full, file.Content);
    }
}
