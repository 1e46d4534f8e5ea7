using System.Diagnostics;
using System.Runtime.ExceptionServices;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.OrTools;

/// <summary>
/// OR-Tools' routing search on the mapped model, started from Anneal's own construction plan. Every solution it
/// accepts is judged by Anneal's evaluator; the best by that judgement is kept and traced, so its plan and trace
/// compare directly with SA's and tabu's. Construction and model building count against the budget, and a native
/// search that does not stop by its deadline is left behind with its best plan so far returned.
/// </summary>
public sealed class OrToolsSolver : ISolver
{
    private readonly OrToolsSettings _settings;
    private readonly IStartPlan? _start;

    /// <param name="start">The warm start (the host's construction); without one OR-Tools finds its own first solution.</param>
    public OrToolsSolver(OrToolsSettings? settings = null, IStartPlan? start = null)
    {
        _settings = settings ?? new OrToolsSettings();
        _start = start;
    }

    public string Name => "ortools";

    public string? Declines(Instance instance) => null;

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        try
        {
            return Run(instance, options, progress, cancel).Result;
        }
        catch (ScalingDeclinedException e)
        {
            return ScalingGuard.Declined(Name, e);
        }
    }

    /// <exception cref="ScalingDeclinedException">when the model does not fit OR-Tools' integers (see <see cref="ScalingGuard"/>).</exception>
    public OrToolsRun Run(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var clock = Stopwatch.StartNew();
        var limit = options.TimeLimit;
        var keeper = new RoutingKeeper(instance, new TraceRecorder(progress, limit.TotalSeconds), clock);
        using var budget = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        budget.CancelAfter(limit);

        // Anneal's construction: the warm start, and the plan returned should OR-Tools never improve on it.
        var warm = _start?.Build(instance, budget.Token);
        bool warmFeasible = warm is not null && keeper.Offer(warm, "construction", countsAsSolution: false) && keeper.Best!.Feasible;
        double constructionSeconds = clock.Elapsed.TotalSeconds;

        var search = new RoutingSearch(instance, options, _settings, keeper, clock);
        Exception? failure = null;
        var native = new Thread(() =>
        {
            try
            {
                search.Run(warmFeasible && !budget.IsCancellationRequested ? warm : null, limit);
            }
            catch (Exception e)
            {
                failure = e;
            }
        })
        {
            IsBackground = true,
            Name = "ortools search",
        };
        native.Start();
        bool leftBehind = !Await(native, search, limit, clock, cancel);
        keeper.Close();
        if (failure is ScalingDeclinedException declined)
        {
            ExceptionDispatchInfo.Throw(declined);
        }

        if (failure is not null)
        {
            throw new InvalidOperationException("OR-Tools failed: " + failure.Message, failure);
        }

        // What the mapping approximates only matters for a plan; without one, say only how the search went.
        var best = keeper.Best;
        var notes = new List<string>(best is null ? [] : search.MappingNotes)
        {
            FormattableString.Invariant($"{(search.Start.Length > 0 ? search.Start : "no search")}, metaheuristic {_settings.Metaheuristic}; construction {constructionSeconds:0.0} s, model {search.BuildSeconds:0.0} s; {keeper.Solutions} solutions accepted"),
        };
        if (keeper.BestSource == "construction")
        {
            notes.Add("OR-Tools did not improve on Anneal's construction, which is returned");
        }

        if (leftBehind)
        {
            notes.Add(FormattableString.Invariant($"OR-Tools did not stop within {_settings.GraceSeconds:0.#} s of its deadline; its search was left behind and its best plan so far is returned"));
        }

        if (search.Engine is { } engine)
        {
            notes.Add(engine.Cost.Compare(PlanEvaluator.Evaluate(instance, engine.Plan).Breakdown));
        }

        if (options.Threads > 1)
        {
            notes.Add("OR-Tools routing search runs on one thread");
        }

        double seconds = clock.Elapsed.TotalSeconds;
        var status = best is null ? SolverStatus.NoSolution
            : cancel.IsCancellationRequested ? SolverStatus.Interrupted
            : search.TargetReached ? SolverStatus.TargetReached
            : options.IterationLimit is long iterations && keeper.Solutions >= iterations ? SolverStatus.IterationLimit
            : leftBehind || seconds >= limit.TotalSeconds * 0.99 ? SolverStatus.TimeLimit
            : SolverStatus.Completed;
        if (best is null)
        {
            notes.Add($"routing status: {search.RoutingStatus}");
        }

        var trace = keeper.Trace;
        if (best is not null)
        {
            trace.Finish(new TracePoint(seconds, keeper.Solutions, best.Objective, best.Objective, best.Feasible, "end"));
        }

        var result = new SolverResult(Name, keeper.BestPlan, seconds, trace.SecondsToBest, trace.Points, status, null, notes) { HasPlan = best is not null };
        return new OrToolsRun(result, search.Engine?.Cost.Reported, search.RoutingStatus, search.Engine?.Cost, search.Engine?.Plan);
    }

    /// <summary>
    /// Waits for the native search. At the deadline or on cancellation asks it to stop, a little later interrupts
    /// it, and after the grace period stops waiting. False when the search was left behind.
    /// </summary>
    private bool Await(Thread native, RoutingSearch search, TimeSpan limit, Stopwatch clock, CancellationToken cancel)
    {
        var grace = TimeSpan.FromSeconds(_settings.GraceSeconds);
        var interruptAfter = grace * 2 / 3;
        TimeSpan? stopAt = null;
        bool interrupted = false;
        while (!native.Join(TimeSpan.FromMilliseconds(20)))
        {
            if (stopAt is null && (cancel.IsCancellationRequested || clock.Elapsed >= limit))
            {
                search.Stop();
                stopAt = clock.Elapsed;
            }

            if (stopAt is not { } at)
            {
                continue;
            }

            if (!interrupted && clock.Elapsed - at > interruptAfter)
            {
                search.Interrupt();
                interrupted = true;
            }

            if (clock.Elapsed - at > grace)
            {
                return false;
            }
        }

        return true;
    }
}
