using System.Diagnostics;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;

namespace Anneal.Search.Running;

/// <summary>
/// Runs independent seeded copies of a solver on separate threads and keeps the best plan. The copies share the
/// run's <see cref="Incumbent"/>; a copy that has not returned <see cref="Slack"/> past the budget (many copies on
/// few cores: one step of each can then take seconds) is not waited for, and the best plan the copies offered
/// stands in for it, so the solver returns within its budget however many copies it runs.
/// </summary>
public static class ParallelRuns
{
    /// <summary>How long past the budget (or a stop) the copies are waited for: less than the run's own tolerance.</summary>
    public static readonly TimeSpan Slack = TimeSpan.FromSeconds(1);

    private static readonly TimeSpan MinimumShare = TimeSpan.FromMilliseconds(10);

    private static readonly TimeSpan Poll = TimeSpan.FromMilliseconds(50);

    public static SolverResult Run(Func<ISolver> create, Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var clock = Stopwatch.StartNew();
        int n = options.Threads;
        var incumbent = options.Incumbent ?? new Incumbent();
        var giveUp = CancellationTokenSource.CreateLinkedTokenSource(cancel); // not disposed when a copy is left: it still reads it
        var results = new SolverResult?[n];
        var done = new CountdownEvent(n); // not disposed: copies left behind still signal it
        var threads = new Thread[n];
        for (int k = 0; k < n; k++)
        {
            int index = k;
            threads[k] = new Thread(() =>
            {
                try
                {
                    // A copy started late (starting 64 searching threads on 2 cores took 7 s) still ends at the
                    // common deadline: its budget is what is left of the solver's.
                    var left = options.TimeLimit - clock.Elapsed;
                    var own = options with { Threads = 1, Seed = options.Seed + (1000 * index), Incumbent = incumbent, TimeLimit = left > MinimumShare ? left : MinimumShare };
                    Volatile.Write(ref results[index], create().Solve(instance, own, index == 0 ? progress : null, giveUp.Token));
                }
                finally
                {
                    done.Signal();
                }
            }) { IsBackground = true };
        }

        // Started from a thread of their own: Thread.Start waits for each thread to run, which is slow when the
        // copies already started keep the cores busy, and the wait below must not depend on it.
        new Thread(() =>
        {
            foreach (var thread in threads)
            {
                thread.Start();
            }
        }) { IsBackground = true }.Start();
        bool all = Wait(done, options.TimeLimit, clock, cancel);

        // What returned in time, read before the late copies are told to stop (a copy returning after that would
        // call itself interrupted).
        var returned = new SolverResult?[n];
        var judged = new PlanEvaluation?[n + 1];
        int count = 0;
        for (int k = 0; k < n; k++)
        {
            var result = returned[k] = Volatile.Read(ref results[k]);
            count += result is null ? 0 : 1;
        }

        if (all)
        {
            giveUp.Dispose();
        }
        else
        {
            giveUp.Cancel();
        }

        for (int k = 0; k < n; k++)
        {
            judged[k] = returned[k] is { HasPlan: true } result ? PlanEvaluator.Evaluate(instance, result.Plan) : null;
        }

        // The copies left behind hold plans of their own: the best any copy offered stands in for them.
        var offered = all ? null : incumbent.Plan;
        judged[n] = offered is null ? null : PlanEvaluator.Evaluate(instance, offered);
        int best = PlanRanking.Best(judged);
        string seeds = $"{n} independent runs (seeds {options.Seed} + 1000·k)";
        string late = FormattableString.Invariant($"{n - count} of the {n} copies did not return within {Slack.TotalSeconds:0.#} s of the {(cancel.IsCancellationRequested ? "stop request" : "budget")} and were not waited for");
        if (best == n && judged[n] is { } fromOffer)
        {
            double seconds = clock.Elapsed.TotalSeconds;
            var point = new TracePoint(seconds, 0, fromOffer.Objective, fromOffer.Objective, fromOffer.Feasible, "offered");
            return new SolverResult(create().Name, offered!, seconds, seconds, [point], cancel.IsCancellationRequested ? SolverStatus.Interrupted : SolverStatus.TimeLimit, null,
                [$"best plan the copies had offered by then, of {seeds}", late]);
        }

        if (returned[best] is not { } chosen)
        {
            // No copy returned and none offered a plan.
            return new SolverResult(create().Name, Plan.Empty, clock.Elapsed.TotalSeconds, 0, [], SolverStatus.NoSolution, null, [late]) { HasPlan = false };
        }

        if (!chosen.HasPlan)
        {
            return chosen;
        }

        var notes = new List<string>(chosen.Notes ?? []) { $"best of {seeds}" };
        if (!all)
        {
            notes.Add(late);
        }

        return chosen with { Notes = notes };
    }

    /// <summary>Waits for every copy until <see cref="Slack"/> past the budget or a stop request; true when all ended.</summary>
    private static bool Wait(CountdownEvent done, TimeSpan budget, Stopwatch clock, CancellationToken stop)
    {
        TimeSpan? stopAt = null;
        while (true)
        {
            stopAt ??= stop.IsCancellationRequested ? clock.Elapsed : null;
            var left = (stopAt is { } at && at < budget ? at : budget) + Slack - clock.Elapsed;
            if (left <= TimeSpan.Zero)
            {
                return done.IsSet;
            }

            if (done.Wait(left < Poll ? left : Poll, CancellationToken.None)) // polled: a stop moves the deadline, it does not end the wait
            {
                return true;
            }
        }
    }
}
