using System.IO.Compression;
using Anneal.Formats.Input;
using Anneal.Worker.Untrusted;

namespace Anneal.Worker;

/// <summary>Finds what to load inside a claimed entry: a CSV job folder or a single benchmark file, unzipping first if needed.</summary>
public static class JobInput
{
    private const string StopsFile = "stops.csv";

    /// <summary>Scratch folder for a zipped job, beside it in the worker's folder; a dot-name so it is never taken for a job.</summary>
    public static string ScratchFor(ClaimedJob job) =>
        Path.Combine(Path.GetDirectoryName(job.Path)!, ".unzipped-" + job.Entry.Name);

    /// <exception cref="InputException">when a .zip cannot be opened, or the job holds anything but plain files.</exception>
    public static string Locate(ClaimedJob job, UnpackLimits? limits = null) => Locate(job.Path, job.Entry.IsFolder, job.Entry.Name, ScratchFor(job), limits);

    /// <summary>What to load for an entry at <paramref name="path"/>; a .zip is unpacked into <paramref name="scratch"/> first.</summary>
    /// <param name="name">The entry's name as the user gave it, for messages.</param>
    /// <param name="limits">How much a .zip may unpack to; <see cref="UnpackLimits.Default"/> when null.</param>
    /// <exception cref="InputException">when a .zip cannot be opened or breaks a limit, or the job holds anything but plain files.</exception>
    public static string Locate(string path, bool isFolder, string name, string scratch, UnpackLimits? limits = null)
    {
        // Nothing in the job is read before every entry is known to be a plain file or folder.
        PlainFiles.Check(path, name);
        if (isFolder)
        {
            return Within(path);
        }

        if (!Path.GetExtension(path).Equals(".zip", StringComparison.OrdinalIgnoreCase))
        {
            return path;
        }

        try
        {
            Entries.TryDelete(scratch);
            SafeUnzip.Extract(path, scratch, name, limits ?? UnpackLimits.Default);
        }
        catch (Exception e) when (e is IOException or InvalidDataException or UnauthorizedAccessException)
        {
            throw new InputException(new InputProblem(name, null, null, null, "the .zip cannot be opened: " + e.Message,
                "zip the job folder again (stops.csv, depots.csv, vehicles.csv at its top or in one folder), or drop the folder itself"));
        }

        return Within(scratch);
    }

    /// <summary>A folder with stops.csv is a CSV job; a folder holding one file is that file; one folder (a zipped folder) is looked into.</summary>
    private static string Within(string folder)
    {
        while (true)
        {
            if (File.Exists(Path.Combine(folder, StopsFile)))
            {
                return folder;
            }

            var files = Visible(Directory.GetFiles(folder));
            var folders = Visible(Directory.GetDirectories(folder));
            if (files.Count == 1 && folders.Count == 0)
            {
                return files[0];
            }

            if (files.Count != 0 || folders.Count != 1)
            {
                // Let the CSV reader name what is missing.
                return folder;
            }

            folder = folders[0];
        }
    }

    private static List<string> Visible(string[] paths)
    {
        var list = new List<string>();
        foreach (var path in paths)
        {
            string name = Path.GetFileName(path);
            if (!Entries.IsHidden(name) && name != "__MACOSX")
            {
                list.Add(path);
            }
        }

        return list;
    }
}
