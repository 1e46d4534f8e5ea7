using System.Diagnostics;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Google.OrTools.ConstraintSolver;
using Google.Protobuf.WellKnownTypes;

namespace Anneal.OrTools;

/// <summary>
/// The native part of a routing run, on a thread of its own so that the caller can stop waiting for it: model
/// building, the warm start from Anneal's construction (or OR-Tools' first-solution heuristic when that plan breaks
/// a hard rule), and the local search until the time left. <see cref="Stop"/> may be called from any thread.
/// </summary>
internal sealed class RoutingSearch(Instance instance, SolveOptions options, OrToolsSettings settings, RoutingKeeper keeper, Stopwatch clock)
{
    private readonly object _gate = new();
    private RoutingModel? _model;
    private volatile bool _stop;

    /// <summary>True when the search ended because a plan reached the target objective.</summary>
    public bool TargetReached { get; private set; }

    /// <summary>OR-Tools' status after the search, or why it did not run.</summary>
    public string RoutingStatus { get; private set; } = "not started";

    /// <summary>How the search started, for the notes.</summary>
    public string Start { get; private set; } = string.Empty;

    public IReadOnlyList<string> MappingNotes { get; private set; } = [];

    /// <summary>OR-Tools' own cost of the solution it returned, part by part, and that solution's plan.</summary>
    public (EngineCost Cost, Plan Plan)? Engine { get; private set; }

    /// <summary>Seconds spent building the model (mapping, closing, reading the warm start).</summary>
    public double BuildSeconds { get; private set; }

    /// <summary>
    /// Asks the search to end: before it starts, or through a search limit OR-Tools checks as it goes, which ends
    /// the search within milliseconds and still returns its best solution.
    /// </summary>
    public void Stop() => _stop = true;

    /// <summary>
    /// OR-Tools' own interrupt, for phases that do not check search limits; a search cancelled this way
    /// returns no solution, so it comes after <see cref="Stop"/> (the keeper holds the best plan anyway).
    /// </summary>
    public void Interrupt()
    {
        lock (_gate)
        {
            _stop = true;
            _model?.CancelSearch();
        }
    }

    /// <param name="warm">Anneal's construction plan when it keeps every hard rule: the first solution.</param>
    /// <param name="until">When the search must end, on <paramref name="clock"/>.</param>
    public void Run(Plan? warm, TimeSpan until)
    {
        if (_stop)
        {
            RoutingStatus = "stopped before the model was built";
            return;
        }

        var built = clock.Elapsed;
        using var mapping = RoutingModelBuilder.Build(instance);
        MappingNotes = mapping.Notes;
        var model = mapping.Model;
        lock (_gate)
        {
            _model = model;
        }

        string phase = "warm start";
        VoidToVoid atSolution = () =>
        {
            keeper.Offer(mapping.CurrentPlan(), phase, countsAsSolution: true);
            phase = settings.Metaheuristic.ToString();
            if (options.TargetObjective is double target && keeper.Best is { Feasible: true } best && best.Objective <= target)
            {
                TargetReached = true;
                model.solver().FinishCurrentSearch();
            }
        };
        VoidToBoolean stopped = () => _stop;
        model.AddAtSolutionCallback(atSolution);
        model.AddSearchMonitor(model.solver().MakeCustomLimit(stopped));

        var parameters = operations_research_constraint_solver.DefaultRoutingSearchParameters();
        // Savings ignores pairs; inserting whole pairs is the library's first-solution method for pickup and delivery.
        var first = instance.HasPairs ? FirstSolutionStrategy.Types.Value.ParallelCheapestInsertion : settings.FirstSolution;
        parameters.FirstSolutionStrategy = first;
        parameters.LocalSearchMetaheuristic = settings.Metaheuristic;
        settings.Tune(parameters, instance.StopCount);
        if (options.IterationLimit is long iterations)
        {
            // Solutions accepted, OR-Tools' nearest notion of an iteration; bounds the run without the clock.
            parameters.SolutionLimit = Math.Max(1, iterations);
        }

        // Reading the warm start runs a small search under the closing parameters: one solution is all it needs
        // (under the full time limit it went on searching for the whole budget on the demo). The solve below
        // replaces these parameters.
        var closing = parameters.Clone();
        closing.SolutionLimit = 1;
        closing.TimeLimit = Duration.FromTimeSpan(Left(until));
        model.CloseModelWithParameters(closing);
        Assignment? initial = null;
        if (warm is not null && !_stop)
        {
            initial = model.ReadAssignmentFromRoutes(mapping.ToRoutes(warm), true);
        }

        BuildSeconds = (clock.Elapsed - built).TotalSeconds;
        Assignment? solution = null;
        if (initial is not null)
        {
            Start = "warm start from Anneal's construction";
            solution = Solve(model, parameters, until, p => model.SolveFromAssignmentWithParameters(initial, p));
        }

        if (solution is null && !_stop && clock.Elapsed < until)
        {
            // The construction broke a hard rule (or OR-Tools' rounding refused it): OR-Tools finds its own start.
            phase = "first solution";
            Start = (initial is null ? string.Empty : "the warm start failed; ") + $"first solution {first}";
            solution = Solve(model, parameters, until, model.SolveWithParameters);
        }

        RoutingStatus = model.GetStatus().ToString();
        if (solution is not null)
        {
            var plan = mapping.ToPlan(solution);
            keeper.Offer(plan, "end", countsAsSolution: false);
            Engine = (EngineCost.Of(mapping, solution), plan);
        }

        lock (_gate)
        {
            _model = null;
        }

        GC.KeepAlive(atSolution);
        GC.KeepAlive(stopped);
    }

    private Assignment? Solve(RoutingModel model, RoutingSearchParameters parameters, TimeSpan until, Func<RoutingSearchParameters, Assignment?> solve)
    {
        parameters.TimeLimit = Duration.FromTimeSpan(Left(until));
        return _stop ? null : solve(parameters);
    }

    private TimeSpan Left(TimeSpan until)
    {
        var left = until - clock.Elapsed;
        return left > TimeSpan.FromMilliseconds(10) ? left : TimeSpan.FromMilliseconds(10);
    }
}
