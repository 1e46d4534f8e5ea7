using System.IO.Compression;
using Anneal.Formats.Input;

namespace Anneal.Worker.Untrusted;

/// <summary>How much a zipped job may unpack to (worker settings <c>MaxZipBytes</c> and <c>MaxZipRatio</c>).</summary>
/// <param name="MaxBytes">Largest total unpacked size.</param>
/// <param name="MaxRatio">Largest ratio of unpacked to packed size, checked once the total passes <see cref="RatioFrom"/>.</param>
public sealed record UnpackLimits(long MaxBytes, double MaxRatio)
{
    /// <summary>Below this total a high ratio is harmless (a small CSV of repeated rows packs tightly), so it is not checked.</summary>
    public const long RatioFrom = 1024 * 1024;

    /// <summary>A job has a handful of files.</summary>
    public const int MaxEntries = 1_000;

    public static UnpackLimits Default { get; } = new(256L * 1024 * 1024, 100);
}

/// <summary>
/// Unpacks a zipped job that nobody vouches for: plain files and folders only (no links or other special entries),
/// every path inside the target folder, the total size and the compression ratio within <see cref="UnpackLimits"/>.
/// The declared sizes are checked before anything is written, and the bytes actually inflated are counted as they
/// come, so a header that lies about a size cannot slip a "zip bomb" past the limits.
/// </summary>
public static class SafeUnzip
{
    private const int UnixTypeMask = 0xF000;
    private const int UnixRegular = 0x8000;
    private const int UnixDirectory = 0x4000;

    /// <param name="name">The zip's name as the user gave it, for messages.</param>
    /// <exception cref="InputException">when the archive breaks a rule or cannot be read.</exception>
    public static void Extract(string zip, string folder, string name, UnpackLimits limits)
    {
        using var archive = ZipFile.OpenRead(zip);
        long packed = Math.Max(1, new FileInfo(zip).Length);
        if (archive.Entries.Count > UnpackLimits.MaxEntries)
        {
            throw Refused(name, $"the .zip holds {archive.Entries.Count:N0} entries, more than the {UnpackLimits.MaxEntries:N0} a job may have");
        }

        long declared = 0;
        string root = Path.GetFullPath(folder) + Path.DirectorySeparatorChar;
        foreach (var entry in archive.Entries)
        {
            int type = (entry.ExternalAttributes >> 16) & UnixTypeMask;
            if (type != 0 && type != UnixRegular && type != UnixDirectory)
            {
                throw Refused(name, $"the .zip entry '{Quote.Cap(entry.FullName)}' is a symbolic link or another special file; a job is plain files only");
            }

            string target = Path.GetFullPath(Path.Combine(folder, entry.FullName));
            if (!target.StartsWith(root, StringComparison.Ordinal) && target + Path.DirectorySeparatorChar != root)
            {
                throw Refused(name, $"the .zip entry '{Quote.Cap(entry.FullName)}' would land outside the job's folder");
            }

            declared += entry.Length;
            Check(name, declared, packed, limits);
        }

        Directory.CreateDirectory(folder);
        long written = 0;
        var buffer = new byte[81920];
        foreach (var entry in archive.Entries)
        {
            string target = Path.GetFullPath(Path.Combine(folder, entry.FullName));
            if (entry.FullName.EndsWith('/') || entry.FullName.EndsWith('\\'))
            {
                Directory.CreateDirectory(target);
                continue;
            }

            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            using var source = entry.Open();
            using var output = new FileStream(target, FileMode.CreateNew, FileAccess.Write);
            long own = 0;
            int read;
            while ((read = source.Read(buffer, 0, buffer.Length)) > 0)
            {
                own += read;
                written += read;
                if (own > entry.Length)
                {
                    throw Refused(name, $"the .zip entry '{Quote.Cap(entry.FullName)}' unpacks to more than the {entry.Length:N0} bytes it declares");
                }

                Check(name, written, packed, limits);
                output.Write(buffer, 0, read);
            }
        }
    }

    private static void Check(string name, long total, long packed, UnpackLimits limits)
    {
        if (total > limits.MaxBytes)
        {
            throw Refused(name, $"the .zip unpacks to more than {limits.MaxBytes:N0} bytes (Worker:MaxZipBytes)");
        }

        if (total > UnpackLimits.RatioFrom && total > limits.MaxRatio * packed)
        {
            throw Refused(name, $"the .zip unpacks to more than {limits.MaxRatio:0.#} times its packed size of {packed:N0} bytes (Worker:MaxZipRatio)");
        }
    }

    private static InputException Refused(string name, string problem) =>
        new(new InputProblem(name, null, null, null, problem, "zip the job's own files again (stops.csv, depots.csv, vehicles.csv at its top or in one folder), or drop the folder itself"));
}
