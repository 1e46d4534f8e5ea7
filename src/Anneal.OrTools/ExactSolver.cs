using System.Diagnostics;
using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Google.OrTools.Sat;

namespace Anneal.OrTools;

/// <summary>
/// CP-SAT on <see cref="ExactModel"/> for small instances: a proven optimum, or when time runs out the best plan
/// with the proven lower bound and the gap. Declines above its stop limit.
/// </summary>
public sealed class ExactSolver : ISolver
{
    private readonly ExactSettings _settings;
    private readonly IStartPlan? _start;

    /// <param name="start">The best known plan's source (the host's construction), given to CP-SAT as a hint.</param>
    public ExactSolver(ExactSettings? settings = null, IStartPlan? start = null)
    {
        _settings = settings ?? new ExactSettings();
        _start = start;
    }

    public string Name => "exact";

    public string? Declines(Instance instance) =>
        instance.StopCount > _settings.StopLimit ? $"{instance.StopCount} stops, above the exact model's limit of {_settings.StopLimit}"
        : instance.HasPickups && !instance.Rules.Capacity.Hard ? "the job has pickups and a soft capacity; the exact model prices overload only on the route's total load, which pickups make wrong"
        : DrivingRulesSupport.Declines(instance);

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var clock = Stopwatch.StartNew();
        if (Declines(instance) is { } reason)
        {
            return SolverResult.Declined(Name, reason);
        }

        // The bound's vehicle count and objective bound go into the model, so that CP-SAT's proof starts from them.
        var hints = Bounds.BoundSolver.Hints(instance, TimeSpan.FromSeconds(Math.Min(2, 0.2 * options.TimeLimit.TotalSeconds)), cancel);
        ExactModel exact;
        try
        {
            exact = new ExactModel(instance, hints);
        }
        catch (ScalingDeclinedException e)
        {
            return ScalingGuard.Declined(Name, e);
        }
        var trace = new TraceRecorder(progress, options.TimeLimit.TotalSeconds);
        var keeper = new Keeper(instance, exact, trace, clock, options.Incumbent);

        // The best known plan (the starting plan given, else Anneal's construction) as a hint when it keeps every
        // hard rule: CP-SAT starts from it, and it is the answer should CP-SAT find nothing better in time.
        bool hinted = false;
        if ((options.StartPlan ?? _start?.Build(instance, cancel)) is { } plan && keeper.OfferConstruction(plan))
        {
            hinted = true;
            exact.Hint(plan);
            CompleteHint(exact, options.TimeLimit - clock.Elapsed, cancel);
        }

        var solver = new CpSolver();
        double seconds = Math.Max(0.01, (options.TimeLimit - clock.Elapsed).TotalSeconds);
        int workers = Math.Max(1, _settings.Workers ?? options.Threads);
        solver.StringParameters = string.Create(CultureInfo.InvariantCulture,
            $"max_time_in_seconds:{seconds} num_workers:{workers} random_seed:{options.Seed}");
        var status = StoppableCpSat.Solve(solver, exact.Model, keeper, cancel);

        if (status is CpSolverStatus.Optimal or CpSolverStatus.Feasible)
        {
            keeper.Offer(exact.Decode(solver.BooleanValue), "final");
        }

        var notes = new List<string>(exact.Notes);
        double? lowerBound = null;
        SolverStatus result;
        switch (status)
        {
            case CpSolverStatus.Optimal:
                result = SolverStatus.Optimal;
                lowerBound = Proven(exact, solver.BestObjectiveBound, hints);
                notes.Add(string.Create(CultureInfo.InvariantCulture, $"proven optimal for the integer model ({exact.Scale.TimeScale} steps per time unit, {exact.Scale.CostScale} per cost unit)"));
                break;
            case CpSolverStatus.Feasible:
                result = cancel.IsCancellationRequested ? SolverStatus.Interrupted : SolverStatus.TimeLimit;
                lowerBound = Proven(exact, solver.BestObjectiveBound, hints);
                double objective = keeper.Best?.Objective ?? exact.Scale.ToObjective(solver.ObjectiveValue);
                notes.Add(lowerBound is { } lb
                    ? string.Create(CultureInfo.InvariantCulture, $"not proven optimal: lower bound {lb:0.###}, gap {(objective > 0 ? (objective - lb) / objective : 0):P2}")
                    : "not proven optimal, and no lower bound proved");
                break;
            case CpSolverStatus.Infeasible:
                // The integer model (rounded times and costs) can be stricter than the evaluator: the hint may
                // still keep every rule. Then the search ended by itself with a plan that is not CP-SAT's.
                result = keeper.Best is null ? SolverStatus.NoSolution : SolverStatus.Completed;
                notes = ["CP-SAT proved that its integer model has no plan that keeps every hard rule"];
                break;
            default:
                result = cancel.IsCancellationRequested ? SolverStatus.Interrupted : keeper.Best is null ? SolverStatus.NoSolution : SolverStatus.TimeLimit;
                if (keeper.Best is not null)
                {
                    lowerBound = hints?.ObjectiveAtLeast;
                }

                break;
        }

        if (keeper.BestIsConstruction)
        {
            // Said first, in every case: the plan shown is Anneal's construction, not a plan CP-SAT found.
            string source = options.StartPlan is null ? "Anneal's construction" : "the plan it was started from";
            string which = hinted ? "the hint it was given" : "which breaks hard rules and so was not given to CP-SAT as a hint";
            notes.Insert(0, status is CpSolverStatus.Optimal or CpSolverStatus.Feasible
                ? $"its plan is {source}, {which}: CP-SAT found none better"
                : $"its plan is {source}, {which}: CP-SAT found no plan of its own");
        }

        if (keeper.Best is null && status != CpSolverStatus.Infeasible)
        {
            notes.Clear(); // what the model approximates only matters for a plan, and there is none
            notes.Add($"CP-SAT status: {status.ToString().ToLowerInvariant()}");
        }

        double total = clock.Elapsed.TotalSeconds;
        if (keeper.Best is { } best)
        {
            trace.Finish(new TracePoint(total, keeper.Solutions, best.Objective, best.Objective, best.Feasible, result.ToText()));
        }

        return new SolverResult(Name, keeper.BestPlan, total, trace.SecondsToBest, trace.Points, result, lowerBound, notes) { HasPlan = keeper.Best is not null };
    }

    /// <summary>
    /// The strongest bound proved on Anneal's objective: the hint's, or CP-SAT's integer bound less its cost rounding
    /// when the integer model keeps exactly Anneal's plans (otherwise CP-SAT proved a bound of another problem).
    /// </summary>
    private static double? Proven(ExactModel exact, double integerBound, ExactHints? hints)
    {
        double? own = exact.AnnealBound(integerBound);
        double? hinted = hints?.ObjectiveAtLeast;
        return own is { } a && hinted is { } b ? Math.Max(a, b) : own ?? hinted;
    }

    /// <summary>
    /// CP-SAT does not reliably complete a hint that gives only the arcs (it left the tight test job without a
    /// solution for seconds): solving once with the hinted arcs fixed yields every variable's value, and that full
    /// solution becomes the hint.
    /// </summary>
    private static void CompleteHint(ExactModel exact, TimeSpan left, CancellationToken cancel)
    {
        var fix = new CpSolver();
        double seconds = Math.Clamp(left.TotalSeconds / 10, 0.01, 2);
        fix.StringParameters = string.Create(CultureInfo.InvariantCulture, $"max_time_in_seconds:{seconds} num_workers:1 fix_variables_to_their_hinted_value:true");
        var status = StoppableCpSat.Solve(fix, exact.Model, null, cancel);
        if (status is CpSolverStatus.Optimal or CpSolverStatus.Feasible)
        {
            exact.HintAll(fix.Response!.Solution);
        }
    }

    /// <summary>Judges every CP-SAT solution with Anneal's evaluator and traces the improvements.</summary>
    private sealed class Keeper(Instance instance, ExactModel exact, TraceRecorder trace, Stopwatch clock, Incumbent? incumbent) : CpSolverSolutionCallback
    {
        public const string HintState = "construction (hint)";
        public const string ConstructionState = "construction";

        public PlanEvaluation? Best { get; private set; }
        public Plan BestPlan { get; private set; } = Plan.Empty;
        public long Solutions { get; private set; }

        /// <summary>The best plan is still Anneal's construction: CP-SAT found none better of its own.</summary>
        public bool BestIsConstruction { get; private set; }

        public override void OnSolutionCallback()
        {
            Solutions++;
            Offer(exact.Decode(BooleanValue), "CP-SAT");
        }

        /// <summary>Keeps Anneal's construction; true when it keeps every hard rule and so may be CP-SAT's hint.</summary>
        public bool OfferConstruction(Plan plan)
        {
            bool feasible = PlanEvaluator.Evaluate(instance, plan).Feasible;
            Offer(plan, feasible ? HintState : ConstructionState);
            return feasible;
        }

        /// <summary>Keeps the plan when it beats the best; returns the evaluator's verdict on it.</summary>
        public PlanEvaluation Offer(Plan plan, string state)
        {
            var judged = PlanEvaluator.Evaluate(instance, plan);
            if (Best is null || judged.IsBetterThan(Best))
            {
                Best = judged;
                BestPlan = plan;
                BestIsConstruction = state is HintState or ConstructionState;
                incumbent?.Offer(plan, judged.Feasible, judged.Objective);
                trace.Improved(new TracePoint(clock.Elapsed.TotalSeconds, Solutions, judged.Objective, judged.Objective, judged.Feasible, state));
            }

            return judged;
        }
    }
}
