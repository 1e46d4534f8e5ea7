using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// What a drafted move would change, from the drafted routes' measures (<see cref="SegmentCache.Measure"/>) against
/// the ledger (<see cref="RouteCosts"/>). Two forms of one evaluation: <see cref="Evaluate"/> under the current
/// prices (the annealing kernel), <see cref="EvaluateParts"/> split by rule for searches that cache moves while the
/// prices change; and <see cref="FeasibleChange"/> for one drafted route that must keep to the hard rules.
/// Every form is property-tested against PlanEvaluator.
/// </summary>
public sealed class MoveEvaluator
{
    private readonly Instance _instance;
    private readonly RouteStore _store;
    private readonly SegmentCache _cache;
    private readonly RouteCosts _costs;
    private readonly RouteMetrics[] _metrics;
    private readonly double[] _objective;
    private readonly double[] _penalized;
    private readonly bool[] _feasible;

    public MoveEvaluator(Instance instance, RouteStore store, SegmentCache cache, RouteCosts costs)
    {
        _instance = instance;
        _store = store;
        _cache = cache;
        _costs = costs;
        _metrics = costs.Metrics;
        _objective = costs.Objectives;
        _penalized = costs.Penalties;
        _feasible = costs.Feasibles;
    }

    /// <summary>Penalized and objective change of a move under the current prices, and feasibility afterwards.</summary>
    public MoveEffect Evaluate(ref MoveDraft move)
    {
        var effect = default(MoveEffect);
        bool feasibleA = true, feasibleB = true;
        if (move.RouteCount > 0)
        {
            feasibleA = AddRouteEffect(ref move.A, ref effect);
        }

        if (move.RouteCount > 1)
        {
            feasibleB = AddRouteEffect(ref move.B, ref effect);
        }

        if (move.Dropped >= 0)
        {
            effect.Penalized += _costs.UnservedCost(move.Dropped);
            effect.Objective += CostModel.UnservedObjective(_instance, move.Dropped);
        }

        if (move.Inserted >= 0)
        {
            effect.Penalized -= _costs.UnservedCost(move.Inserted);
            effect.Objective -= CostModel.UnservedObjective(_instance, move.Inserted);
        }

        effect.FeasibleAfter = FeasibleAfter(ref move, feasibleA, feasibleB);
        return effect;
    }

    /// <summary>The move's effect split by rule (see <see cref="MoveParts"/>).</summary>
    public MoveParts EvaluateParts(ref MoveDraft move)
    {
        var parts = default(MoveParts);
        bool feasibleA = true, feasibleB = true;
        if (move.RouteCount > 0)
        {
            feasibleA = AddRouteParts(ref move.A, ref parts);
        }

        if (move.RouteCount > 1)
        {
            feasibleB = AddRouteParts(ref move.B, ref parts);
        }

        if (move.Dropped >= 0)
        {
            parts.Objective += CostModel.UnservedObjective(_instance, move.Dropped);
            parts.Violation.Unserved += _instance.MayDrop(move.Dropped) ? 0 : 1;
        }

        if (move.Inserted >= 0)
        {
            parts.Objective -= CostModel.UnservedObjective(_instance, move.Inserted);
            parts.Violation.Unserved -= _instance.MayDrop(move.Inserted) ? 0 : 1;
        }

        parts.FeasibleAfter = FeasibleAfter(ref move, feasibleA, feasibleB);
        parts.EmptiesRoute = EmptiesRoute(ref move);
        parts.OpensRoute = OpensRoute(ref move);
        if (move.RouteCount > 0)
        {
            parts.InfeasibleRoutes += (feasibleA ? 0 : 1) - (_feasible[move.A.Route] ? 0 : 1);
        }

        if (move.RouteCount > 1)
        {
            parts.InfeasibleRoutes += (feasibleB ? 0 : 1) - (_feasible[move.B.Route] ? 0 : 1);
        }

        return parts;
    }

    /// <summary>Objective change of the route a draft describes, when that route keeps to the hard rules.</summary>
    public bool FeasibleChange(ref RouteDraft draft, out double objectiveChange)
    {
        var m = _cache.Measure(ref draft);
        if (!CostModel.RouteFeasible(_instance, m))
        {
            objectiveChange = 0;
            return false;
        }

        objectiveChange = CostModel.RouteObjective(_instance, draft.Route, m) - _objective[draft.Route];
        return true;
    }

    /// <summary>Feasibility after a move whose parts were computed earlier, against the plan as it is now.</summary>
    public bool FeasibleAfter(in MoveParts parts) =>
        _costs.InfeasibleRoutes + parts.InfeasibleRoutes == 0 && _costs.MandatoryUnserved + parts.Violation.Unserved == 0;

    /// <summary>Does the move put stops on a route that has none now?</summary>
    public bool OpensRoute(ref MoveDraft move) =>
        (move.RouteCount > 0 && move.A.Count > 0 && _store.Length(move.A.Route) == 0)
        || (move.RouteCount > 1 && move.B.Count > 0 && _store.Length(move.B.Route) == 0);

    /// <summary>Does the move take the last stops off a route?</summary>
    public bool EmptiesRoute(ref MoveDraft move) =>
        (move.RouteCount > 0 && move.A.Count == 0 && _store.Length(move.A.Route) > 0)
        || (move.RouteCount > 1 && move.B.Count == 0 && _store.Length(move.B.Route) > 0);

    /// <summary>Would the plan break no hard rule after this move, given the verdicts on its drafted routes?</summary>
    private bool FeasibleAfter(ref MoveDraft move, bool feasibleA, bool feasibleB)
    {
        int infeasible = _costs.InfeasibleRoutes;
        if (move.RouteCount > 0)
        {
            infeasible += (feasibleA ? 0 : 1) - (_feasible[move.A.Route] ? 0 : 1);
        }

        if (move.RouteCount > 1)
        {
            infeasible += (feasibleB ? 0 : 1) - (_feasible[move.B.Route] ? 0 : 1);
        }

        int mandatory = _costs.MandatoryUnserved;
        if (move.Dropped >= 0 && !_instance.MayDrop(move.Dropped))
        {
            mandatory++;
        }

        if (move.Inserted >= 0 && !_instance.MayDrop(move.Inserted))
        {
            mandatory--;
        }

        return infeasible == 0 && mandatory == 0;
    }

    /// <summary>Adds one drafted route's cost change to the effect; returns whether that route breaks no hard rule.</summary>
    private bool AddRouteEffect(ref RouteDraft draft, ref MoveEffect effect)
    {
        var m = _cache.Measure(ref draft);
        double objective = CostModel.RouteObjective(_instance, draft.Route, m);
        effect.Objective += objective - _objective[draft.Route];
        effect.Penalized += objective + CostModel.RouteViolation(_instance, m, _costs.Weights) - _penalized[draft.Route];
        return CostModel.RouteFeasible(_instance, m);
    }

    private bool AddRouteParts(ref RouteDraft draft, ref MoveParts parts)
    {
        var m = _cache.Measure(ref draft);
        ref readonly var old = ref _metrics[draft.Route];
        var rules = _instance.Rules;
        parts.Objective += CostModel.RouteObjective(_instance, draft.Route, m) - _objective[draft.Route];
        if (rules.TimeWindows.Hard)
        {
            parts.Violation.TimeWindow += Amount(m.TimeWindowViolation, m) - Amount(old.TimeWindowViolation, old);
        }

        if (rules.Capacity.Hard)
        {
            parts.Violation.Capacity += Amount(m.Overload, m) - Amount(old.Overload, old);
        }

        if (rules.ShiftEnd.Hard)
        {
            parts.Violation.Overtime += Amount(m.Overtime, m) - Amount(old.Overtime, old);
        }

        if (rules.MaxDuration.Hard)
        {
            parts.Violation.Duration += Amount(m.DurationExcess, m) - Amount(old.DurationExcess, old);
        }

        // Hard driving rules share the duration's price (see CostModel.RouteViolation).
        parts.Violation.Duration += Amount(m.DrivingBreach, m) - Amount(old.DrivingBreach, old);

        // A broken pair is priced as missing equipment is (CostModel.RouteViolation).
        parts.Violation.Equipment += Amount(m.MissingEquipment + m.PairBreaks, m) - Amount(old.MissingEquipment + old.PairBreaks, old);
        return CostModel.RouteFeasible(_instance, m);
    }

    // An empty route breaks nothing, whatever its measures say.
    private static double Amount(double value, in RouteMetrics m) => m.StopCount == 0 ? 0 : value;
}
