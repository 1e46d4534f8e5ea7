using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Search.Representation;

/// <summary>
/// The ledger of what the routes cost now: each route's measures, objective, penalized cost (under the search's
/// current hard-rule prices) and verdict, the running totals with the unserved stops, and how many routes and
/// mandatory stops break a hard rule.
/// </summary>
public sealed class RouteCosts
{
    private readonly Instance _instance;
    private readonly RouteStore _store;

    // Shared with the move evaluator, which compares a draft with the route it replaces.
    internal readonly RouteMetrics[] Metrics;
    internal readonly double[] Objectives;
    internal readonly double[] Penalties;
    internal readonly bool[] Feasibles;
    private PenaltyWeights _weights;

    public RouteCosts(Instance instance, RouteStore store, PenaltyWeights weights)
    {
        _instance = instance;
        _store = store;
        _weights = weights;
        int routes = store.RouteCount;
        Metrics = new RouteMetrics[routes];
        Objectives = new double[routes];
        Penalties = new double[routes];
        Feasibles = new bool[routes];
        Array.Fill(Feasibles, true);
    }

    public ref readonly PenaltyWeights Weights => ref _weights;

    /// <summary>Running total of the objective (kept by every change; re-summed when the prices change).</summary>
    public double Objective { get; private set; }

    /// <summary>Running total of the penalized cost.</summary>
    public double Penalized { get; private set; }

    /// <summary>Routes that break a hard rule now (unserved stops aside).</summary>
    public int InfeasibleRoutes { get; private set; }

    /// <summary>Stops that must be served and are not.</summary>
    public int MandatoryUnserved { get; private set; }

    public double UnservedCost(int stop) => CostModel.UnservedObjective(_instance, stop) + CostModel.UnservedViolation(_instance, stop, _weights);

    /// <summary>Records a route's new measures.</summary>
    internal void Refresh(int route, in RouteMetrics m)
    {
        bool wasFeasible = Feasibles[route];
        Metrics[route] = m;
        Objective -= Objectives[route];
        Penalized -= Penalties[route];
        Objectives[route] = CostModel.RouteObjective(_instance, route, m);
        Penalties[route] = CostModel.RoutePenalized(_instance, route, m, _weights);
        Objective += Objectives[route];
        Penalized += Penalties[route];
        Feasibles[route] = CostModel.RouteFeasible(_instance, m);
        if (wasFeasible != Feasibles[route])
        {
            InfeasibleRoutes += Feasibles[route] ? -1 : 1;
        }
    }

    internal void Unserve(int stop)
    {
        Objective += CostModel.UnservedObjective(_instance, stop);
        Penalized += UnservedCost(stop);
        if (!_instance.MayDrop(stop))
        {
            MandatoryUnserved++;
        }
    }

    internal void Serve(int stop)
    {
        Objective -= CostModel.UnservedObjective(_instance, stop);
        Penalized -= UnservedCost(stop);
        if (!_instance.MayDrop(stop))
        {
            MandatoryUnserved--;
        }
    }

    /// <summary>New hard-rule prices: every route's penalized cost and both totals are summed afresh.</summary>
    public void SetWeights(in PenaltyWeights weights)
    {
        _weights = weights;
        for (int r = 0; r < Penalties.Length; r++)
        {
            Penalties[r] = CostModel.RoutePenalized(_instance, r, Metrics[r], _weights);
        }

        Objective = SumObjective();
        Penalized = SumPenalized();
    }

    private double SumObjective()
    {
        double total = 0;
        for (int r = 0; r < Objectives.Length; r++)
        {
            total += Objectives[r];
        }

        for (int k = 0; k < _store.UnservedCount; k++)
        {
            total += CostModel.UnservedObjective(_instance, _store.UnservedAt(k));
        }

        return total;
    }

    private double SumPenalized()
    {
        double total = 0;
        for (int r = 0; r < Penalties.Length; r++)
        {
            total += Penalties[r];
        }

        for (int k = 0; k < _store.UnservedCount; k++)
        {
            total += UnservedCost(_store.UnservedAt(k));
        }

        return total;
    }

    /// <summary>Total violation per hard rule over all routes (zero where the rule is soft).</summary>
    public RuleAmounts Violations()
    {
        var rules = _instance.Rules;
        var v = default(RuleAmounts);
        for (int r = 0; r < Metrics.Length; r++)
        {
            if (Feasibles[r])
            {
                continue;
            }

            ref readonly var m = ref Metrics[r];
            v.TimeWindow += rules.TimeWindows.Hard ? m.TimeWindowViolation : 0;
            v.Capacity += rules.Capacity.Hard ? m.Overload : 0;
            v.Overtime += rules.ShiftEnd.Hard ? m.Overtime : 0;
            v.Duration += (rules.MaxDuration.Hard ? m.DurationExcess : 0) + m.DrivingBreach;
            v.Equipment += m.MissingEquipment + m.PairBreaks;
        }

        v.Unserved = MandatoryUnserved;
        return v;
    }
}
