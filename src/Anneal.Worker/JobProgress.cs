using Anneal.Core.Solving;
using Microsoft.Extensions.Logging;

namespace Anneal.Worker;

/// <summary>The latest trace point of each solver on one running job, for the status file and the log.</summary>
public sealed class JobProgress(ClaimedJob job, ILogger log, TimeProvider clock)
{
    private readonly SolverPoints _points = new(clock);

    public ClaimedJob Job => job;

    public void Report(string solver, TracePoint point)
    {
        if (_points.Record(solver, point))
        {
            WorkerLog.JobProgress(log, job.Id, solver, point.BestObjective, point.BestFeasible ? "feasible" : "infeasible", point.Seconds);
        }
    }

    public RunningJobStatus Snapshot(DateTimeOffset now)
    {
        var solvers = new List<SolverStatus>();
        foreach (var (name, p) in _points.Latest())
        {
            solvers.Add(new SolverStatus(name, p.BestObjective, p.BestFeasible, p.Seconds, p.Iteration));
        }

        return new RunningJobStatus(job.Id, job.Attempt, job.ClaimedAt, (now - job.ClaimedAt).TotalSeconds, solvers);
    }
}
