using Anneal.Formats.Output;

namespace Anneal.Worker;

/// <summary>The four folders of the worker's contract, as full paths.</summary>
public sealed record WorkerFolders(string Inbox, string Outbox, string Working, string Failed)
{
    /// <summary>Relative paths are taken from the current folder; working and failed default to siblings of the inbox.</summary>
    public static WorkerFolders From(WorkerOptions options)
    {
        string inbox = Full(options.Inbox!);
        string parent = Path.GetDirectoryName(inbox) ?? inbox;
        return new WorkerFolders(
            inbox,
            Full(options.Outbox!),
            string.IsNullOrWhiteSpace(options.Working) ? Path.Combine(parent, "working") : Full(options.Working),
            string.IsNullOrWhiteSpace(options.Failed) ? Path.Combine(parent, "failed") : Full(options.Failed));
    }

    /// <exception cref="OutputException">when a folder cannot be created.</exception>
    public void Create()
    {
        foreach (var path in new[] { Inbox, Outbox, Working, Failed })
        {
            try
            {
                Directory.CreateDirectory(path);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw OutputException.ForFolder(path, e);
            }
        }
    }

    private static string Full(string path) => Path.TrimEndingDirectorySeparator(Path.GetFullPath(path));
}
