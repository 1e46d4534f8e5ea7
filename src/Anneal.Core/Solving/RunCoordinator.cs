using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Core.Solving;

/// <summary>
/// Runs several solvers side by side on one instance with the same wall-clock budget. A solver still running
/// <see cref="Grace"/> past its budget (or past a stop request) is no longer waited for: the run goes on with the
/// others' plans, and that solver is reported as overrun with the best plan it had offered to its
/// <see cref="Incumbent"/> (none if it offered none).
/// </summary>
public static class RunCoordinator
{
    /// <summary>How long past the budget a solver is waited for: the tolerance every budget allows, max(2 s, 5%).</summary>
    public static TimeSpan Grace(TimeSpan budget) => TimeSpan.FromSeconds(Math.Max(2, 0.05 * budget.TotalSeconds));

    /// <param name="solvers">Solver k runs with seed + k. One that declines the instance is not started.</param>
    /// <param name="progress">Receives (solver name, trace point) from every solver as it improves.</param>
    /// <param name="judge">Judges each result (the host's may also offer a better form of an infeasible plan); by default the evaluator's verdict on the plan as it is.</param>
    public static RunOutcome Run(
        Instance instance,
        IReadOnlyList<ISolver> solvers,
        SolveOptions options,
        Action<string, TracePoint>? progress,
        CancellationToken cancel,
        Func<Instance, SolverResult, JudgedResult>? judge = null)
    {
        judge ??= static (instance, result) => new JudgedResult(result, PlanEvaluator.Evaluate(instance, result.Plan));
        var clock = System.Diagnostics.Stopwatch.StartNew();

        // Cancelled for solvers the run stops waiting for, so that those that look at it still stop (late); not
        // disposed then, since they may still register with it.
        var giveUp = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        var token = giveUp.Token;
        var results = new SolverResult?[solvers.Count];
        var traces = new List<TracePoint>[solvers.Count];
        var incumbents = new Incumbent[solvers.Count];
        var threads = new List<Thread>(solvers.Count);
        for (int k = 0; k < solvers.Count; k++)
        {
            var solver = solvers[k];
            if (solver.Declines(instance) is { } reason)
            {
                results[k] = SolverResult.Declined(solver.Name, reason);
                continue;
            }

            int index = k;
            var own = options with { Seed = options.Seed + index, Incumbent = incumbents[k] = new Incumbent() };
            var trace = traces[k] = [];
            IProgress<TracePoint> sink = new SynchronousProgress(p =>
            {
                lock (trace)
                {
                    trace.Add(p);
                }

                progress?.Invoke(solver.Name, p);
            });
            threads.Add(new Thread(() => Volatile.Write(ref results[index], solver.Solve(instance, own, sink, token)))
            {
                IsBackground = true,
                Name = "solver " + solver.Name,
            });
        }

        foreach (var t in threads)
        {
            t.Start();
        }

        var grace = Grace(options.TimeLimit);
        DeadlineJoin.Wait(threads, options.TimeLimit, grace, clock, cancel);

        var judged = new JudgedResult[results.Length];
        bool left = false;
        for (int k = 0; k < results.Length; k++)
        {
            left |= Volatile.Read(ref results[k]) is null;
        }

        if (left)
        {
            giveUp.Cancel();
        }
        else
        {
            giveUp.Dispose();
        }

        for (int k = 0; k < results.Length; k++)
        {
            var result = Volatile.Read(ref results[k]) ?? Overran(solvers[k].Name, clock.Elapsed, traces[k], incumbents[k]?.Plan, grace, cancel.IsCancellationRequested);
            judged[k] = judge(instance, result);
        }

        return new RunOutcome(judged, Choose(judged)) { Interrupted = cancel.IsCancellationRequested };
    }

    /// <summary>The first result that no later one beats in <see cref="PlanRanking"/>'s order; a solver without a plan is never chosen over one with.</summary>
    public static int Choose(IReadOnlyList<JudgedResult> judged)
    {
        var ranked = new PlanEvaluation?[judged.Count];
        for (int k = 0; k < ranked.Length; k++)
        {
            ranked[k] = judged[k].Ranked;
        }

        return PlanRanking.Best(ranked);
    }

    /// <summary>A solver that did not return in time: its trace so far, the best plan it had offered (if any), and why.</summary>
    private static SolverResult Overran(string solver, TimeSpan elapsed, List<TracePoint> trace, Plans.Plan? incumbent, TimeSpan grace, bool interrupted)
    {
        TracePoint[] points;
        lock (trace)
        {
            points = [.. trace];
        }

        string reason = FormattableString.Invariant($"did not stop within {grace.TotalSeconds:0.#} s of its {(interrupted ? "stop request" : "budget")}; the run went on without waiting, {(incumbent is null ? "and it had offered no plan" : "with the best plan it had offered by then")}");
        return new SolverResult(solver, incumbent ?? Plans.Plan.Empty, elapsed.TotalSeconds, points.Length > 0 ? points[^1].Seconds : 0, points,
            SolverStatus.Overran, null, [reason]) { HasPlan = incumbent is not null };
    }

    private sealed class SynchronousProgress(Action<TracePoint> report) : IProgress<TracePoint>
    {
        public void Report(TracePoint value) => report(value);
    }
}
