using System.Diagnostics;
using System.Globalization;
using Anneal.Bounds.Relaxation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;

namespace Anneal.OrTools.Bounds;

/// <summary>
/// `bound`: proves a lower bound on the objective of every plan that keeps the hard rules, and offers no plan. It
/// raises the bound in stages within the budget, each valid on its own, so an interrupted run still reports the
/// strongest bound finished so far: the fewest vehicles and their fixed costs with each stop's cheapest arcs
/// (<see cref="ArcShareBound"/>), then LP relaxations. What the relaxation gives up is in
/// <see cref="RelaxedInstance"/>; the result's notes say it for the instance at hand.
/// </summary>
public sealed class BoundSolver : ISolver
{
    public string Name => "bound";

    /// <summary>A job without stops has nothing to bound; whether the relaxation admits a bound is known only once it is built (<see cref="Solve"/>).</summary>
    public string? Declines(Instance instance) =>
        instance.StopCount == 0 ? "the job has no stops"
        : instance.HasPickups ? "the job has pickups; the relaxation's capacity bounds count every load as leaving the depot, which would not be a valid bound"
        : null;

    /// <summary>
    /// The proven facts the exact model may assume, from the bound's stages run for at most <paramref name="budget"/>:
    /// null when the instance admits no bound.
    /// </summary>
    public static ExactHints? Hints(Instance instance, TimeSpan budget, CancellationToken cancel)
    {
        var relaxed = RelaxedInstance.Build(instance);
        if (relaxed.Declined is not null)
        {
            return null;
        }

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        stop.CancelAfter(budget);
        var keeper = new BoundKeeper(new TraceRecorder(null, budget.TotalSeconds), Stopwatch.StartNew());
        var vehicles = BoundStages.Run(relaxed, keeper, [], stop.Token);
        return new ExactHints(vehicles.Vehicles, keeper.Best);
    }

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var clock = Stopwatch.StartNew();
        var trace = new TraceRecorder(progress, options.TimeLimit.TotalSeconds);
        var keeper = new BoundKeeper(trace, clock);
        var relaxed = RelaxedInstance.Build(instance);
        var notes = new List<string>();
        if (relaxed.Declined is { } why)
        {
            return SolverResult.Declined(Name, "no bound: " + why, boundOnly: true);
        }

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        stop.CancelAfter(options.TimeLimit);
        BoundStages.Run(relaxed, keeper, notes, stop.Token);

        if (relaxed.Relaxed.Count > 0)
        {
            notes.Add("relaxed for the bound: " + string.Join("; ", relaxed.Relaxed));
        }

        var status = cancel.IsCancellationRequested ? SolverStatus.Interrupted : stop.IsCancellationRequested ? SolverStatus.TimeLimit : SolverStatus.Completed;
        if (keeper.Best is { } best)
        {
            notes.Add(string.Create(CultureInfo.InvariantCulture, $"lower bound {best:0.###} from {keeper.Source}"));
            trace.Finish(keeper.Point(keeper.Source!));
        }

        return new SolverResult(Name, Plan.Empty, clock.Elapsed.TotalSeconds, trace.SecondsToBest, trace.Points, status, keeper.Best, notes, BoundOnly: true);
    }
}
