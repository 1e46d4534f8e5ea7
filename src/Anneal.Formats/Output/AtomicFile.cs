using System.Text;

namespace Anneal.Formats.Output;

/// <summary>
/// Writes a file so that readers see either the old content or the complete new one, never half a file:
/// the content goes to a temporary file in the same folder (same volume, so the move is a rename), then replaces the target.
/// </summary>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    /// <exception cref="OutputException">when the folder or file cannot be written.</exception>
    public static void Write(string path, Action<Stream> write)
    {
        string full = System.IO.Path.GetFullPath(path);
        string folder = System.IO.Path.GetDirectoryName(full) ?? ".";
        string temp = System.IO.Path.Combine(folder, $"{System.IO.Path.GetFileName(full)}.tmp-{Guid.NewGuid():N}");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temp, full, overwrite: true);
        }
        catch (Exception e)
        {
            TryDelete(temp);
            if (e is IOException or UnauthorizedAccessException)
            {
                throw OutputException.For(path, e);
            }

            throw;
        }
    }

    /// <summary>UTF-8 text without a byte-order mark.</summary>
    public static void WriteText(string path, Action<TextWriter> write) =>
        Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 65536, leaveOpen: true);
            write(writer);
            writer.Flush();
        });

    private static void TryDelete(string temp)
    {
        try
        {
            File.Delete(temp);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The original error matters more than a leftover temporary file.
        }
    }
}
