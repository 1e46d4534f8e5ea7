using Anneal.Core.DrivingRules;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Core.Evaluation;

/// <summary>The one evaluator: schedule, cost breakdown and verdict per hard rule for a whole plan.</summary>
public static class PlanEvaluator
{
    private const double Tolerance = CostModel.FeasibilityTolerance;

    public static PlanEvaluation Evaluate(Instance instance, Plan plan)
    {
        var structure = plan.StructureErrors(instance);
        if (structure.Count > 0)
        {
            throw new ArgumentException("The plan is malformed: " + string.Join("; ", structure), nameof(plan));
        }

        var rules = instance.Rules;
        var routes = new List<RouteEvaluation>();
        var violations = new List<Violation>();
        var served = new bool[instance.StopCount];
        int stranded = 0;
        double drivingOver = 0, stability = 0, fixedCost = 0, distanceCost = 0, timeCost = 0, vehicles = 0, lateness = 0, overload = 0, overtime = 0, durationExcess = 0;
        int dims = instance.DimensionCount;

        var costs = instance.Costs;
        foreach (var route in plan.Routes)
        {
            var visits = new VisitTimes[route.Stops.Length];
            var breaks = instance.Vehicles[route.Vehicle].DrivingRules is null ? null : new List<PlannedBreak>();
            var m = RouteScheduler.Schedule(instance, route.Vehicle, route.Stops, visits, breaks);
            var loads = RouteLoads.After(instance, route.Stops);
            for (int k = 0; k < route.Stops.Length; k++)
            {
                served[route.Stops[k]] = true;
            }

            // The route's stability price is in its measures (and so in its objective), from the starts just scheduled.
            stability += m.Stability;
            double objective = CostModel.RouteObjective(instance, route.Vehicle, m);
            bool drivable = CostModel.RouteFeasible(instance, m, Tolerance);
            routes.Add(new RouteEvaluation(route.Vehicle, route.Stops, m, visits, loads, objective, drivable) { Breaks = breaks ?? [] });
            foreach (int s in route.Stops)
            {
                stranded += drivable || instance.MayDrop(s) ? 0 : 1;
            }

            if (m.StopCount == 0)
            {
                continue;
            }

            // The cost model's rates; a vehicle's price is a fixed cost, or under vehicles-then-distance the vehicle count's weight.
            var rates = costs.Rates(route.Vehicle);
            if (instance.Objective == Objective.VehiclesThenDistance)
            {
                vehicles += rates.Fixed;
            }
            else
            {
                fixedCost += rates.Fixed;
            }

            distanceCost += m.Distance * rates.PerDistance;
            timeCost += m.Duration * rates.PerTime;

            if (!rules.TimeWindows.Hard)
            {
                lateness += m.TimeWindowViolation * rules.TimeWindows.Price;
            }

            if (!rules.Capacity.Hard)
            {
                overload += m.Overload * rules.Capacity.Price;
            }

            if (!rules.ShiftEnd.Hard)
            {
                overtime += m.Overtime * rules.ShiftEnd.Price;
            }

            if (!rules.MaxDuration.Hard)
            {
                durationExcess += m.DurationExcess * rules.MaxDuration.Price;
            }

            drivingOver += m.DrivingOver * costs.DrivingPrice[route.Vehicle];

            ReportRoute(instance, route, m, visits, loads, violations);
        }

        PairReport.Add(instance, plan, violations);
        var unserved = new List<int>();
        double unservedCost = 0;
        for (int s = 0; s < instance.StopCount; s++)
        {
            if (served[s])
            {
                continue;
            }

            unserved.Add(s);
            unservedCost += CostModel.UnservedObjective(instance, s);
            bool mayDrop = instance.MayDrop(s);
            stranded += mayDrop ? 0 : 1;
            violations.Add(new Violation(RuleKind.Unserved, !mayDrop, null, instance.Stops[s].Id, 1,
                mayDrop
                    ? $"stop {instance.Stops[s].Id} is left unserved (penalty {instance.UnservedPrice(s):0.##})"
                    : $"stop {instance.Stops[s].Id} must be served but is on no route"));
        }

        var breakdown = new CostBreakdown
        {
            Fixed = fixedCost,
            Distance = distanceCost,
            Time = timeCost,
            Vehicles = vehicles,
            Lateness = lateness,
            Overload = overload,
            Overtime = overtime,
            DurationExcess = durationExcess,
            DrivingOver = drivingOver,
            Unserved = unservedCost,
            Stability = stability,
        };
        return new PlanEvaluation(routes, unserved, breakdown, violations) { Stranded = stranded };
    }

    /// <summary>The search's cost of a plan under the given hard-rule weights.</summary>
    public static double Penalized(Instance instance, Plan plan, in PenaltyWeights weights)
    {
        var served = new bool[instance.StopCount];
        double total = 0;
        foreach (var route in plan.Routes)
        {
            var m = RouteScheduler.Measure(instance, route.Vehicle, route.Stops);
            total += CostModel.RoutePenalized(instance, route.Vehicle, m, weights);
            foreach (int s in route.Stops)
            {
                served[s] = true;
            }
        }

        for (int s = 0; s < instance.StopCount; s++)
        {
            if (!served[s])
            {
                total += CostModel.UnservedObjective(instance, s) + CostModel.UnservedViolation(instance, s, weights);
            }
        }

        return total;
    }

    private static void ReportRoute(Instance instance, PlannedRoute route, in RouteMetrics m, VisitTimes[] visits, double[][] loads, List<Violation> violations)
    {
        var rules = instance.Rules;
        var v = instance.Vehicles[route.Vehicle];
        string unit = instance.Units.TimeWords;
        for (int k = 0; k < route.Stops.Length; k++)
        {
            if (visits[k].Late > Tolerance)
            {
                var stop = instance.Stops[route.Stops[k]];
                string how = rules.TimeWindows.Hard ? "arrives after its window closes" : "is served late";
                violations.Add(new Violation(RuleKind.TimeWindow, rules.TimeWindows.Hard, v.Id, stop.Id, visits[k].Late,
                    $"stop {stop.Id} {how} by {visits[k].Late:0.##} {unit} (vehicle {v.Id}, position {k + 1})"));
            }

            ulong missing = instance.Stops[route.Stops[k]].Needs & ~v.Equipment;
            if (missing != 0)
            {
                var stop = instance.Stops[route.Stops[k]];
                violations.Add(new Violation(RuleKind.Equipment, true, v.Id, stop.Id, System.Numerics.BitOperations.PopCount(missing),
                    $"stop {stop.Id} needs {EquipmentList(instance, missing)}, which vehicle {v.Id} lacks"));
            }
        }

        if (m.Overload > Tolerance)
        {
            violations.Add(instance.HasPickups
                ? OverloadAlong(instance, route, m.Overload, loads)
                : new Violation(RuleKind.Capacity, rules.Capacity.Hard, v.Id, null, m.Overload,
                    $"vehicle {v.Id} is loaded {m.Overload:0.##} units over its capacity"));
        }

        if (m.Overtime > Tolerance)
        {
            violations.Add(new Violation(RuleKind.ShiftEnd, rules.ShiftEnd.Hard, v.Id, null, m.Overtime,
                $"vehicle {v.Id} returns {m.Overtime:0.##} {unit} after its shift ends"));
        }

        if (m.DurationExcess > Tolerance)
        {
            violations.Add(new Violation(RuleKind.MaxDuration, rules.MaxDuration.Hard, v.Id, null, m.DurationExcess,
                $"route of vehicle {v.Id} lasts {m.DurationExcess:0.##} {unit} longer than allowed"));
        }

        if (v.DrivingRules is { } driving)
        {
            // Never shortened to fit: the route stays as planned and the breach is reported.
            var (drive, span) = BreakScheduler.Excess(instance, driving, m);
            if (drive > Tolerance)
            {
                violations.Add(new Violation(RuleKind.DrivingTime, driving.Rule.Hard, v.Id, null, drive,
                    $"vehicle {v.Id} drives {m.Driving:0.##} {unit} in the day, {drive:0.##} {unit} over {driving.Title}"));
            }

            if (span > Tolerance)
            {
                violations.Add(new Violation(RuleKind.DutySpan, driving.Rule.Hard, v.Id, null, span,
                    $"duty span of vehicle {v.Id} is {m.Return - m.Departure:0.##} {unit}, {span:0.##} {unit} over {driving.Title}"));
            }
        }
    }

    /// <summary>With pickups the load changes along the route: name where it first goes over and by how much.</summary>
    private static Violation OverloadAlong(Instance instance, PlannedRoute route, double overload, double[][] loads)
    {
        var v = instance.Vehicles[route.Vehicle];
        int dims = instance.DimensionCount;
        for (int d = 0; d < dims; d++)
        {
            double capacity = instance.Capacity(route.Vehicle, d);
            double start = RouteLoads.Departure(instance, route.Stops, d);
            if (start > capacity + Tolerance)
            {
                return new Violation(RuleKind.Capacity, instance.Rules.Capacity.Hard, v.Id, null, overload,
                    $"vehicle {v.Id} leaves the depot with {start:0.##} {instance.DimensionNames[d]}, {start - capacity:0.##} over its capacity {capacity:0.##}");
            }

            for (int k = 0; k < loads.Length; k++)
            {
                if (loads[k][d] > capacity + Tolerance)
                {
                    var stop = instance.Stops[route.Stops[k]];
                    return new Violation(RuleKind.Capacity, instance.Rules.Capacity.Hard, v.Id, stop.Id, overload,
                        $"vehicle {v.Id} carries {loads[k][d]:0.##} {instance.DimensionNames[d]} after stop {stop.Id} (position {k + 1}), {loads[k][d] - capacity:0.##} over its capacity {capacity:0.##}");
                }
            }
        }

        return new Violation(RuleKind.Capacity, instance.Rules.Capacity.Hard, v.Id, null, overload,
            $"vehicle {v.Id} is loaded {overload:0.##} units over its capacity");
    }

    private static string EquipmentList(Instance instance, ulong mask)
    {
        var names = new List<string>();
        for (int b = 0; b < instance.EquipmentNames.Count; b++)
        {
            if ((mask & (1UL << b)) != 0)
            {
                names.Add(instance.EquipmentNames[b]);
            }
        }

        return string.Join(", ", names);
    }
}
