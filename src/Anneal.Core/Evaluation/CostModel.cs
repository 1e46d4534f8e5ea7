using Anneal.Core.Model;

namespace Anneal.Core.Evaluation;

/// <summary>
/// Turns route measures into cost. Shared by the exact evaluator and every incremental move evaluation,
/// so the two can only disagree on the measures, which the property tests compare.
/// </summary>
public static class CostModel
{
    /// <summary>The part of the objective a route contributes: its base cost plus soft-rule penalties.</summary>
    public static double RouteObjective(Instance instance, int vehicle, in RouteMetrics m)
    {
        if (m.StopCount == 0)
        {
            return 0;
        }

        var v = instance.Vehicles[vehicle];
        var rules = instance.Rules;
        double cost = instance.Objective switch
        {
            Objective.Cost => v.FixedCost + (m.Distance * v.CostPerDistance) + (m.Duration / instance.TimeUnitsPerHour * v.CostPerHour),
            Objective.Distance => m.Distance,
            _ => instance.VehicleWeight + m.Distance,
        };
        if (!rules.TimeWindows.Hard)
        {
            cost += m.TimeWindowViolation * rules.TimeWindows.Price;
        }

        if (!rules.Capacity.Hard)
        {
            cost += m.Overload * rules.Capacity.Price;
        }

        if (!rules.ShiftEnd.Hard)
        {
            cost += m.Overtime * rules.ShiftEnd.Price;
        }

        if (!rules.MaxDuration.Hard)
        {
            cost += m.DurationExcess * rules.MaxDuration.Price;
        }

        return cost;
    }

    /// <summary>Weighted amount by which the route breaks hard rules (zero for a feasible route).</summary>
    public static double RouteViolation(Instance instance, in RouteMetrics m, in PenaltyWeights w)
    {
        if (m.StopCount == 0)
        {
            return 0;
        }

        var rules = instance.Rules;
        double p = m.MissingSkills * w.Skill;
        if (rules.TimeWindows.Hard)
        {
            p += m.TimeWindowViolation * w.TimeWindow;
        }

        if (rules.Capacity.Hard)
        {
            p += m.Overload * w.Capacity;
        }

        if (rules.ShiftEnd.Hard)
        {
            p += m.Overtime * w.Overtime;
        }

        if (rules.MaxDuration.Hard)
        {
            p += m.DurationExcess * w.Duration;
        }

        return p;
    }

    /// <summary>Search cost of a route: objective part plus weighted hard violations.</summary>
    public static double RoutePenalized(Instance instance, int vehicle, in RouteMetrics m, in PenaltyWeights w) =>
        RouteObjective(instance, vehicle, m) + RouteViolation(instance, m, w);

    /// <summary>Objective contribution of leaving a stop unserved (its price when it may be dropped).</summary>
    public static double UnservedObjective(Instance instance, int stop) =>
        instance.MayDrop(stop) ? instance.UnservedPrice(stop) : 0;

    /// <summary>Search penalty for leaving a stop unserved that must be served.</summary>
    public static double UnservedViolation(Instance instance, int stop, in PenaltyWeights w) =>
        instance.MayDrop(stop) ? 0 : w.Unserved;

    /// <summary>True when the measures break no hard rule.</summary>
    /// <summary>Violations at or below this are rounding, not breaks.</summary>
    public const double FeasibilityTolerance = 1e-6;

    public static bool RouteFeasible(Instance instance, in RouteMetrics m, double tolerance = FeasibilityTolerance)
    {
        if (m.StopCount == 0)
        {
            return true;
        }

        var rules = instance.Rules;
        return m.MissingSkills == 0
            && (!rules.TimeWindows.Hard || m.TimeWindowViolation <= tolerance)
            && (!rules.Capacity.Hard || m.Overload <= tolerance)
            && (!rules.ShiftEnd.Hard || m.Overtime <= tolerance)
            && (!rules.MaxDuration.Hard || m.DurationExcess <= tolerance);
    }
}
