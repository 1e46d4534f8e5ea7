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
public sealed class OrToolsSolver : ISolver, ISolverAdvice
{
    /// <summary>
    /// Above this many stops `ortools` is left out of the default solvers: its model needs hundreds of megabytes
    /// (about 800 MB at 10,000 stops and 1,500 vehicles, more than the other solvers together) and its search rarely
    /// improves on the construction it starts from within minutes. Named explicitly, it still runs.
    /// </summary>
    public const int DefaultStopLimit = 5000;

    private readonly OrToolsSettings _settings;
    private readonly IStartPlan? _start;

    /// <param name="start">The warm start (the host's construction); without one OR-Tools finds its own first solution.</param>
    public OrToolsSolver(OrToolsSettings? settings = null, IStartPlan? start = null)
    {
        _settings = settings ?? new OrToolsSettings();
        _start = start;
    }

    public string Name => "ortools";

    public string? Declines(Instance instance) => DrivingRulesSupport.Declines(instance);

    public string? LeftOutOfDefaults(Instance instance) => instance.StopCount <= DefaultStopLimit ? null : FormattableString.Invariant(
        $"ortools is left out of the default solvers above {DefaultStopLimit:N0} stops (this job has {instance.StopCount:N0}): its model would need about {ExpectedMegabytes(instance):N0} MB and its search rarely improves on the construction it starts from at this size; name it in --solvers to run it anyway");

    public string? BeforeRun(Instance instance) => instance.StopCount <= RoutingModelBuilder.MatrixLimit ? null : FormattableString.Invariant(
        $"expected peak memory with OR-Tools' model about {ExpectedMegabytes(instance):N0} MB ({instance.StopCount:N0} stops, {instance.Vehicles.Count:N0} vehicles)");

    /// <summary>
    /// The process's peak memory with OR-Tools' model, in MB, fitted to measurements on subsets of the 10,000-stop
    /// planar instance (2,000 to 10,000 stops, 300 to 1,500 vehicles; see DEVELOPERS.md): about 110 MB, 25 KB per
    /// stop, and 28 bytes per stop and vehicle (OR-Tools keeps per-vehicle data over all nodes). Rounded up to 50 MB.
    /// </summary>
    public static double ExpectedMegabytes(Instance instance)
    {
        double n = instance.StopCount, v = instance.Vehicles.Count;
        double mb = 110 + (n * 25.0 / 1024) + (n * v * 28 / (1024 * 1024));
        return Math.Ceiling(mb / 50) * 50;
    }

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
        var keeper = new RoutingKeeper(instance, new TraceRecorder(progress, limit.TotalSeconds), clock, options.Incumbent);
        using var budget = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        budget.CancelAfter(limit);

        // Anneal's construction: the warm start, and the plan returned should OR-Tools never improve on it.
        var warm = options.StartPlan ?? _start?.Build(instance, budget.Token);
        bool warmFeasible = warm is not null && keeper.Offer(warm, "construction", countsAsSolution: false) && keeper.Best!.Feasible;
        double constructionSeconds = clock.Elapsed.TotalSeconds;

        var search = new RoutingSearch(instance, options, _settings, keeper, clock);
        bool leftBehind = false;
        Exception? failure = null;
        bool skipped = budget.IsCancellationRequested;
        if (skipped)
        {
            // The construction took the whole budget (or a stop came): there is no time for OR-Tools' model.
            search.Stop();
        }
        else
        {
            leftBehind = !RunNative(search, warmFeasible ? warm : null, limit, clock, cancel, out failure);
        }

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
            FormattableString.Invariant($"{(search.Start.Length > 0 ? search.Start : skipped ? "no OR-Tools search (no time left after the construction)" : "no search")}, metaheuristic {_settings.Metaheuristic}; construction {constructionSeconds:0.0} s, model {search.BuildSeconds:0.0} s; {keeper.Solutions} solutions accepted"),
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

    /// <summary>Runs the native part on its own thread; false when it had to be left behind.</summary>
    private bool RunNative(RoutingSearch search, Core.Plans.Plan? warm, TimeSpan limit, Stopwatch clock, CancellationToken cancel, out Exception? failure)
    {
        Exception? caught = null;
        var native = new Thread(() =>
        {
            try
            {
                search.Run(warm, limit);
            }
            catch (Exception e)
            {
                caught = e;
            }
        })
        {
            IsBackground = true,
            Name = "ortools search",
        };
        native.Start();
        bool finished = Await(native, search, limit, clock, cancel);
        failure = finished ? caught : null;
        return finished;
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
