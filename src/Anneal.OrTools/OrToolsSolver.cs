using System.Diagnostics;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Google.OrTools.ConstraintSolver;
using Google.Protobuf.WellKnownTypes;

namespace Anneal.OrTools;

/// <summary>
/// OR-Tools' routing search on the mapped model. Every solution it accepts is judged by Anneal's evaluator; the
/// best by that judgement is kept and traced, so its plan and trace compare directly with SA's and tabu's.
/// </summary>
public sealed class OrToolsSolver : ISolver
{
    private readonly OrToolsSettings _settings;

    public OrToolsSolver(OrToolsSettings? settings = null)
    {
        _settings = settings ?? new OrToolsSettings();
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
        using var mapping = RoutingModelBuilder.Build(instance);
        var model = mapping.Model;
        var trace = new TraceRecorder(progress, options.TimeLimit.TotalSeconds);
        PlanEvaluation? best = null;
        Plan bestPlan = Plan.Empty;
        double? engineObjective = null;
        long solutions = 0;
        bool targetReached = false;
        string phase = "first solution";

        void Offer(Plan plan, long engineCost)
        {
            var judged = PlanEvaluator.Evaluate(instance, plan);
            if (best is null || judged.IsBetterThan(best))
            {
                best = judged;
                bestPlan = plan;
                engineObjective = mapping.Scale.ToObjective(engineCost);
                trace.Improved(new TracePoint(clock.Elapsed.TotalSeconds, solutions, judged.Objective, judged.Objective, judged.Feasible, phase));
            }
        }

        // OR-Tools calls back on every accepted solution, improving or not; Offer keeps only improvements.
        VoidToVoid atSolution = () =>
        {
            solutions++;
            Offer(mapping.CurrentPlan(), model.CostVar().Value());
            phase = _settings.Metaheuristic.ToString();
            if (options.TargetObjective is double target && best is { Feasible: true } && best.Objective <= target)
            {
                targetReached = true;
                model.solver().FinishCurrentSearch();
            }
        };
        VoidToBoolean cancelled = () => cancel.IsCancellationRequested;
        model.AddAtSolutionCallback(atSolution);
        model.AddSearchMonitor(model.solver().MakeCustomLimit(cancelled));

        var parameters = operations_research_constraint_solver.DefaultRoutingSearchParameters();
        parameters.FirstSolutionStrategy = _settings.FirstSolution;
        parameters.LocalSearchMetaheuristic = _settings.Metaheuristic;
        var left = options.TimeLimit - clock.Elapsed;
        parameters.TimeLimit = Duration.FromTimeSpan(left > TimeSpan.FromMilliseconds(10) ? left : TimeSpan.FromMilliseconds(10));
        if (options.IterationLimit is long iterations)
        {
            // Solutions accepted, OR-Tools' nearest notion of an iteration; bounds the run without the clock.
            parameters.SolutionLimit = Math.Max(1, iterations);
        }

        var solution = model.SolveWithParameters(parameters);
        if (solution is not null)
        {
            Offer(mapping.ToPlan(solution), solution.ObjectiveValue());
        }

        string routingStatus = model.GetStatus().ToString();
        GC.KeepAlive(atSolution);
        GC.KeepAlive(cancelled);

        // What the mapping approximates only matters for a plan; without one, say only how the search went.
        var notes = new List<string>(best is null ? [] : mapping.Notes)
        {
            $"first solution {_settings.FirstSolution}, metaheuristic {_settings.Metaheuristic}; {solutions} solutions accepted",
        };
        if (options.Threads > 1)
        {
            notes.Add("OR-Tools routing search runs on one thread");
        }

        double seconds = clock.Elapsed.TotalSeconds;
        var status = best is null ? SolverStatus.NoSolution
            : cancel.IsCancellationRequested ? SolverStatus.Interrupted
            : targetReached ? SolverStatus.TargetReached
            : options.IterationLimit is long limit && solutions >= limit ? SolverStatus.IterationLimit
            : seconds >= options.TimeLimit.TotalSeconds * 0.99 ? SolverStatus.TimeLimit
            : SolverStatus.Completed;
        if (best is null)
        {
            notes.Add($"routing status: {routingStatus}");
        }
        if (best is not null)
        {
            trace.Finish(new TracePoint(seconds, solutions, best.Objective, best.Objective, best.Feasible, "end"));
        }

        var result = new SolverResult(Name, bestPlan, seconds, trace.SecondsToBest, trace.Points, status, null, notes) { HasPlan = best is not null };
        return new OrToolsRun(result, engineObjective, routingStatus);
    }
}
