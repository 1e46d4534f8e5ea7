namespace Anneal.Formats.Output;

/// <summary>An output file or folder could not be written; names the path so the user can fix permissions or space.</summary>
public sealed class OutputException : Exception
{
    public string Path { get; private init; } = string.Empty;

    public OutputException()
        : base("output cannot be written")
    {
    }

    public OutputException(string message)
        : base(message)
    {
    }

    public OutputException(string message, Exception inner)
        : base(message, inner)
    {
    }

    /// <summary>A file that cannot be written, in a plain sentence.</summary>
    public static OutputException For(string path, Exception inner) =>
        new($"cannot write {path}: {FileTrouble.Writing(path, inner)}", inner) { Path = path };

    /// <summary>A folder that cannot be created, in a plain sentence.</summary>
    public static OutputException ForFolder(string path, Exception inner) =>
        new($"the folder {path} cannot be created: {FileTrouble.Writing(path, inner)}", inner) { Path = path };

    /// <summary>
    /// The same failure, saying that the run's folder was left as it was (no file of the run in it); the file is named
    /// where it was to appear, not in the hidden <paramref name="staging"/> folder it was being written to.
    /// </summary>
    public static OutputException NothingKept(OutputException e, string folder, string staging) =>
        new($"{e.Message.Replace(staging, folder, StringComparison.Ordinal)}; nothing of this run was kept in {folder}", e.InnerException ?? e)
        {
            Path = e.Path.Replace(staging, folder, StringComparison.Ordinal),
        };
}
