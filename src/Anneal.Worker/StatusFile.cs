using System.Text.Json;
using Anneal.Formats.Output;

namespace Anneal.Worker;

/// <summary>
/// working/&lt;worker&gt;.status.json: counts and running jobs with their solvers' progress, rewritten whole (temporary
/// file, then rename) so a reader never sees half of it.
/// </summary>
public sealed class StatusFile(string path, string workerId, DateTimeOffset startedAt)
{
    public const string Extension = ".status.json";

    private const int RecentKept = 20;

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true, Encoder = Anneal.Formats.Output.JsonText.Encoder };

    private readonly Lock _lock = new();
    private readonly Dictionary<ClaimedJob, JobProgress> _running = [];
    private readonly List<FinishedJobStatus> _recent = [];
    private int _done;
    private int _failed;
    private int _requeued;

    public string Path => path;

    public static string PathFor(string working, string workerId) => System.IO.Path.Combine(working, workerId + Extension);

    public void Started(JobProgress progress)
    {
        lock (_lock)
        {
            _running[progress.Job] = progress;
        }
    }

    public void Finished(ClaimedJob job, JobResult result, string where, DateTimeOffset now)
    {
        lock (_lock)
        {
            _running.Remove(job);
            switch (result)
            {
                case JobResult.Solved or JobResult.Interrupted:
                    _done++;
                    break;
                case JobResult.Failed:
                    _failed++;
                    break;
                default:
                    _requeued++;
                    break;
            }

            _recent.Insert(0, new FinishedJobStatus(job.Id, result.ToString().ToLowerInvariant(), where, now));
            if (_recent.Count > RecentKept)
            {
                _recent.RemoveAt(_recent.Count - 1);
            }
        }
    }

    /// <exception cref="OutputException">when the file cannot be written.</exception>
    public void Write(string state, DateTimeOffset now)
    {
        WorkerStatus status;
        lock (_lock)
        {
            var running = new List<RunningJobStatus>();
            foreach (var progress in _running.Values)
            {
                running.Add(progress.Snapshot(now));
            }

            running.Sort((a, b) => a.ClaimedAt.CompareTo(b.ClaimedAt));
            status = new WorkerStatus(workerId, Environment.MachineName, Environment.ProcessId, state, startedAt, now, _done, _failed, _requeued, running, [.. _recent]);
        }

        AtomicFile.Write(path, stream => JsonSerializer.Serialize(stream, status, Json));
    }
}
