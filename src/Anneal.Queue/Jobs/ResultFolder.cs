using Anneal.Formats.Output;
using Anneal.Queue.Inputs;

namespace Anneal.Queue.Jobs;

/// <summary>Writes a job's stored files as DIR/&lt;job id&gt;/, complete or not at all (a dot-named folder renamed into place), replacing an earlier fetch.</summary>
public static class ResultFolder
{
    /// <exception cref="OutputException">when the folder cannot be written.</exception>
    public static string Write(string root, long id, IReadOnlyList<StoredFile> files)
    {
        string name = id.ToString(System.Globalization.CultureInfo.InvariantCulture);
        string target = Path.Combine(root, name);
        string partial = Path.Combine(root, $".partial-{name}-{Guid.NewGuid():N}");
        string? old = null;
        try
        {
            Directory.CreateDirectory(partial);
            foreach (var file in files)
            {
                InputKinds.Write(partial, file);
            }

            if (Directory.Exists(target))
            {
                old = Path.Combine(root, $".old-{name}-{Guid.NewGuid():N}");
                Directory.Move(target, old);
            }

            Directory.Move(partial, target);
            if (old is not null)
            {
                Directory.Delete(old, recursive: true);
            }

            return target;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            if (Directory.Exists(partial))
            {
                Directory.Delete(partial, recursive: true);
            }

            throw OutputException.For(target, e);
        }
    }
}
