using System.Text.Json;
using Anneal.Core.Solving;
using Anneal.Queue.Jobs;
using Anneal.Worker;
using Microsoft.Extensions.Logging;

namespace Anneal.Queue.Worker;

/// <summary>The latest trace point of each solver on one running job: stored by the heartbeat, logged every 10 s.</summary>
public sealed class QueueProgress(long jobId, ILogger log, TimeProvider clock)
{
    private readonly SolverPoints _points = new(clock);

    public void Report(string solver, TracePoint point)
    {
        if (_points.Record(solver, point))
        {
            QueueLog.JobProgress(log, jobId, solver, point.BestObjective, point.BestFeasible ? "feasible" : "infeasible", point.Seconds);
        }
    }

    /// <summary>The jobs.progress document: each solver's best so far; null before the first report.</summary>
    public string? Json()
    {
        var list = new List<SolverProgress>();
        foreach (var (name, p) in _points.Latest())
        {
            list.Add(new SolverProgress(name, double.IsFinite(p.BestObjective) ? p.BestObjective : null, p.BestFeasible, p.Seconds, p.Iteration));
        }

        return list.Count == 0 ? null : JsonSerializer.Serialize(list, StatusQuery.Json);
    }
}
