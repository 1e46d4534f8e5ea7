using Anneal.Worker;

namespace Anneal.Queue.Inputs;

/// <summary>A CSV job folder: every visible file in it (and in its subfolders), by relative path.</summary>
public sealed class FolderInput : IInputKind
{
    public string Name => "folder";

    public bool Accepts(string path) => Directory.Exists(path);

    public IReadOnlyList<StoredFile> Pack(string path)
    {
        string root = Path.GetFullPath(path);
        var files = new List<StoredFile>();
        long total = 0;
        foreach (var file in Directory.EnumerateFiles(root, "*", SearchOption.AllDirectories))
        {
            string relative = Path.GetRelativePath(root, file);
            if (relative.Split(Path.DirectorySeparatorChar).Any(Entries.IsHidden))
            {
                continue;
            }

            files.Add(new StoredFile(relative.Replace(Path.DirectorySeparatorChar, '/'), InputKinds.Read(file, Path.Combine(path, relative), ref total)));
        }

        files.Sort((a, b) => string.CompareOrdinal(a.Path, b.Path));
        return files;
    }

    public string Unpack(string scratch, string jobName, IReadOnlyList<StoredFile> files)
    {
        string folder = Path.Combine(scratch, jobName);
        Directory.CreateDirectory(folder);
        foreach (var file in files)
        {
            InputKinds.Write(folder, file);
        }

        return JobInput.Locate(folder, isFolder: true, jobName, Path.Combine(scratch, ".unzipped"));
    }
}
