using System.Globalization;

namespace Anneal.Worker;

/// <summary>
/// An inbox entry's name read as a job: "&lt;job&gt;[~r&lt;retries&gt;][&lt;.ext&gt;]". Folders have no extension; files
/// (a .zip or a single benchmark file) keep theirs. The retry mark is how a job carries its failure count between
/// workers without any shared database.
/// </summary>
public sealed record JobEntry(string Job, int Retries, string Extension, bool IsFolder)
{
    private const string RetryMark = "~r";

    /// <summary>The name the entry has with its current retry count.</summary>
    public string Name => Job + (Retries > 0 ? RetryMark + Retries.ToString(CultureInfo.InvariantCulture) : string.Empty) + Extension;

    /// <summary>The name the user gave it (no retry mark), used when the input is handed back in failed/.</summary>
    public string OriginalName => Job + Extension;

    public static JobEntry Parse(string name, bool isFolder)
    {
        string extension = isFolder ? string.Empty : Path.GetExtension(name);
        string stem = name[..^extension.Length];
        int mark = stem.LastIndexOf(RetryMark, StringComparison.Ordinal);
        if (mark > 0 && int.TryParse(stem.AsSpan(mark + RetryMark.Length), NumberStyles.None, CultureInfo.InvariantCulture, out int retries))
        {
            return new JobEntry(stem[..mark], retries, extension, isFolder);
        }

        return new JobEntry(stem.Length == 0 ? name : stem, 0, stem.Length == 0 ? string.Empty : extension, isFolder);
    }

    public JobEntry WithRetries(int retries) => this with { Retries = retries };
}
