using Anneal.Formats.Input;

namespace Anneal.Queue.Inputs;

/// <summary>
/// One way a job can be given: what paths it takes, which files it stores, and how they are laid out again for the
/// reader. A new kind (a workbook, say) is one class more in <see cref="InputKinds.All"/>.
/// </summary>
public interface IInputKind
{
    /// <summary>Stored in jobs.kind.</summary>
    string Name { get; }

    bool Accepts(string path);

    /// <exception cref="InputException">when the input cannot be read or is too large to store.</exception>
    IReadOnlyList<StoredFile> Pack(string path);

    /// <summary>Writes the files into <paramref name="scratch"/> (an empty folder of its own) and returns what the reader loads.</summary>
    /// <param name="jobName">The job's name: a folder keeps it, since the instance is named after its folder.</param>
    /// <exception cref="InputException">when the stored files cannot be laid out (a damaged .zip).</exception>
    string Unpack(string scratch, string jobName, IReadOnlyList<StoredFile> files);
}
