using Anneal.Worker;

namespace Anneal.Queue.Inputs;

/// <summary>A .zip of a CSV job folder (its files at the top or in one folder), stored as it is and unpacked for each run.</summary>
public sealed class ZipInput : IInputKind
{
    public string Name => "zip";

    public bool Accepts(string path) => File.Exists(path) && Path.GetExtension(path).Equals(".zip", StringComparison.OrdinalIgnoreCase);

    public IReadOnlyList<StoredFile> Pack(string path)
    {
        long total = 0;
        return [new StoredFile(Path.GetFileName(path), InputKinds.Read(path, path, ref total))];
    }

    public string Unpack(string scratch, string jobName, IReadOnlyList<StoredFile> files)
    {
        var zip = files[0];
        InputKinds.Write(scratch, zip);
        return JobInput.Locate(Path.Combine(scratch, zip.Path), isFolder: false, zip.Path, Path.Combine(scratch, jobName));
    }
}
