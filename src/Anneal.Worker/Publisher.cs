namespace Anneal.Worker;

/// <summary>
/// Makes a job folder appear complete or not at all: everything is written into a dot-named partial folder inside the
/// destination, which is then renamed to the job's name in one step.
/// </summary>
public static class Publisher
{
    private const string PartialPrefix = ".partial-";

    /// <summary>The prefix of every partial folder a worker makes, so that recovery finds a dead worker's leftovers.</summary>
    public static string PartialPrefixOf(string workerId) => PartialPrefix + workerId + "-";

    public static string NewPartial(string root, string workerId, string job)
    {
        string path = Path.Combine(root, $"{PartialPrefixOf(workerId)}{job}-{Guid.NewGuid().ToString("N")[..8]}");
        Directory.CreateDirectory(path);
        return path;
    }

    /// <summary>
    /// Renames <paramref name="partial"/> to root/&lt;job&gt;. A folder there that holds an interrupted plan put back for
    /// another try is replaced; any other one is kept and the new folder takes the name &lt;job&gt;-2, -3 ….
    /// </summary>
    /// <returns>The published folder.</returns>
    public static string Publish(string partial, string root, string job, string workerId)
    {
        string target = Path.Combine(root, job);
        if (JobRecord.TryRead(target) is { Final: false })
        {
            string aside = Path.Combine(root, $"{PartialPrefixOf(workerId)}replaced-{Guid.NewGuid().ToString("N")[..8]}");
            try
            {
                Directory.Move(target, aside);
                Directory.Move(partial, target);
                Entries.TryDelete(aside);
                return target;
            }
            catch (IOException)
            {
                // Another worker replaced it first: publish under a free name below.
            }
        }

        for (int n = 2; ; n++)
        {
            try
            {
                Directory.Move(partial, target);
                return target;
            }
            catch (IOException) when (Entries.Exists(target))
            {
                target = Path.Combine(root, $"{job}-{n}");
            }
        }
    }
}
