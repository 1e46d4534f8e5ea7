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

        var c = instance.Costs;
        return c.Base[vehicle] + (m.Distance * c.PerDistance[vehicle]) + (m.Duration * c.PerTime[vehicle])
            + (m.TimeWindowViolation * c.SoftTimeWindow) + (m.Overload * c.SoftCapacity)
            + (m.Overtime * c.SoftOvertime) + (m.DurationExcess * c.SoftDuration) + (m.DrivingOver * c.DrivingPrice[vehicle]) + m.Stability;
    }

    /// <summary>Weighted amount by which the route breaks hard rules (zero for a feasible route).</summary>
    public static double RouteViolation(Instance instance, in RouteMetrics m, in PenaltyWeights w)
    {
        if (m.StopCount == 0)
        {
            return 0;
        }

        var c = instance.Costs;
        return ((m.MissingEquipment + m.PairBreaks) * w.Equipment) + (m.TimeWindowViolation * c.HardTimeWindow * w.TimeWindow)
            + (m.Overload * c.HardCapacity * w.Capacity) + (m.Overtime * c.HardOvertime * w.Overtime)
            + (m.DurationExcess * c.HardDuration * w.Duration)

            // Hard driving rules (the day's driving, the duty span) are time limits like the maximum duration and share its price.
            + (m.DrivingBreach * w.Duration);
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

    /// <summary>
    /// The stability price of serving <paramref name="stop"/> with <paramref name="vehicle"/>, starting service at
    /// <paramref name="start"/>: the move price when the given plan had it on another vehicle, and the per-minute price
    /// of the start's shift beyond the tolerance. Zero for a stop the given plan did not have (and outside a re-plan).
    /// </summary>
    public static double StopStability(Instance instance, int stop, int vehicle, double start)
    {
        var s = instance.Stops[stop];
        var prices = instance.Rules.Stability;
        double cost = 0;
        if (s.PlannedVehicle >= 0 && s.PlannedVehicle != vehicle)
        {
            cost += prices.PerMove;
        }

        if (!double.IsNaN(s.PlannedStart))
        {
            double shift = Math.Abs(start - s.PlannedStart) - prices.ToleranceMinutes;
            cost += shift > 0 ? shift * prices.PerMinute : 0;
        }

        return cost;
    }

    /// <summary>Violations at or below this are rounding, not breaks.</summary>
    public const double FeasibilityTolerance = 1e-6;

    /// <summary>True when the measures break no hard rule.</summary>
    public static bool RouteFeasible(Instance instance, in RouteMetrics m, double tolerance = FeasibilityTolerance)
    {
        if (m.StopCount == 0)
        {
            return true;
        }

        var c = instance.Costs;
        return m.MissingEquipment == 0
            && m.PairBreaks == 0
            && m.TimeWindowViolation * c.HardTimeWindow <= tolerance
            && m.Overload * c.HardCapacity <= tolerance
            && m.Overtime * c.HardOvertime <= tolerance
            && m.DurationExcess * c.HardDuration <= tolerance
            && m.DrivingBreach <= tolerance;
    }
}
