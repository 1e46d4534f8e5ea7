using Anneal.Core.Solving;
using Microsoft.Extensions.Logging;

namespace Anneal.Worker;

/// <summary>
/// The latest trace point of each solver on one running job, for the status file and the log. Solvers report from
/// their own threads, hence the lock.
/// </summary>
public sealed class JobProgress(ClaimedJob job, ILogger log, TimeProvider clock)
{
    // A line per solver at most this often keeps an overnight log readable.
    private static readonly TimeSpan LogEvery = TimeSpan.FromSeconds(10);

    private readonly Lock _lock = new();
    private readonly Dictionary<string, TracePoint> _latest = new(StringComparer.Ordinal);
    private readonly Dictionary<string, DateTimeOffset> _logged = new(StringComparer.Ordinal);

    public ClaimedJob Job => job;

    public void Report(string solver, TracePoint point)
    {
        bool due;
        lock (_lock)
        {
            _latest[solver] = point;
            var now = clock.GetUtcNow();
            due = !_logged.TryGetValue(solver, out var last) || now - last >= LogEvery;
            if (due)
            {
                _logged[solver] = now;
            }
        }

        if (due)
        {
            log.LogInformation("Job {JobId}: {Solver} best {BestObjective:F2} ({Feasibility}) after {Elapsed:F1} s",
                job.Id, solver, point.BestObjective, point.BestFeasible ? "feasible" : "infeasible", point.Seconds);
        }
    }

    public RunningJobStatus Snapshot(DateTimeOffset now)
    {
        var solvers = new List<SolverStatus>();
        lock (_lock)
        {
            foreach (var (name, p) in _latest)
            {
                solvers.Add(new SolverStatus(name, p.BestObjective, p.BestFeasible, p.Seconds, p.Iteration));
            }
        }

        solvers.Sort((a, b) => string.CompareOrdinal(a.Solver, b.Solver));
        return new RunningJobStatus(job.Id, job.Attempt, job.ClaimedAt, (now - job.ClaimedAt).TotalSeconds, solvers);
    }
}
