using System.Diagnostics;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;

namespace Anneal.OrTools;

/// <summary>
/// The best plan of a routing run by Anneal's evaluator, offered from the native search thread and read by the
/// thread that waits for it; once closed, late offers (from a search that overran and was left) are ignored.
/// </summary>
internal sealed class RoutingKeeper(Instance instance, TraceRecorder trace, Stopwatch clock, Incumbent? incumbent)
{
    private readonly object _gate = new();
    private bool _closed;

    public PlanEvaluation? Best { get; private set; }

    public Plan BestPlan { get; private set; } = Plan.Empty;

    /// <summary>Where the best plan came from ("construction", or the routing search's phase).</summary>
    public string BestSource { get; private set; } = string.Empty;

    public long Solutions { get; private set; }

    public TraceRecorder Trace => trace;

    /// <summary>Judges <paramref name="plan"/> and keeps it when it beats the best; false once closed.</summary>
    public bool Offer(Plan plan, string source, bool countsAsSolution)
    {
        var judged = PlanEvaluator.Evaluate(instance, plan);
        lock (_gate)
        {
            if (_closed)
            {
                return false;
            }

            if (countsAsSolution)
            {
                Solutions++;
            }

            if (Best is null || judged.IsBetterThan(Best))
            {
                Best = judged;
                BestPlan = plan;
                BestSource = source;
                incumbent?.Offer(plan, judged.Feasible, judged.Objective);
                trace.Improved(new TracePoint(clock.Elapsed.TotalSeconds, Solutions, judged.Objective, judged.Objective, judged.Feasible, source));
            }

            return true;
        }
    }

    /// <summary>No more offers: the result is taken now.</summary>
    public void Close()
    {
        lock (_gate)
        {
            _closed = true;
        }
    }
}
