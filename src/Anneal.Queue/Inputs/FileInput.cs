namespace Anneal.Queue.Inputs;

/// <summary>A single input file (a Solomon or CVRPLIB benchmark file), under its own name.</summary>
public sealed class FileInput : IInputKind
{
    public string Name => "file";

    public bool Accepts(string path) => File.Exists(path);

    public IReadOnlyList<StoredFile> Pack(string path)
    {
        long total = 0;
        return [new StoredFile(Path.GetFileName(path), InputKinds.Read(path, path, ref total))];
    }

    public string Unpack(string scratch, string jobName, IReadOnlyList<StoredFile> files)
    {
        InputKinds.Write(scratch, files[0]);
        return Path.Combine(scratch, files[0].Path);
    }
}
