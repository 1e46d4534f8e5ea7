using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>
/// OR-Tools' own objective of one of its solutions, part by part in Anneal's units, read from the model's
/// coefficients and the solution's values, so it can be set beside the evaluator's breakdown of the same plan.
/// </summary>
/// <param name="Parts">The parts in Anneal's terms; <see cref="CostBreakdown.Total"/> is their sum.</param>
/// <param name="Reported">The objective OR-Tools reported for the solution (descaled); equals the parts' sum.</param>
/// <param name="Lateness">Per stop, time units past the last window's close by OR-Tools' schedule.</param>
public sealed record EngineCost(CostBreakdown Parts, double Reported, double[] Lateness)
{
    public static EngineCost Of(RoutingMapping mapping, Assignment solution)
    {
        var instance = mapping.Instance;
        var scale = mapping.Scale;
        var model = mapping.Model;
        var time = model.GetMutableDimension(RoutingModelBuilder.TimeDimension);
        long fixedCost = 0, arcs = 0, span = 0, overtime = 0, excess = 0, overload = 0, lateness = 0, unserved = 0;
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            long index = model.Start(v);
            long next = solution.Value(model.NextVar(index));
            if (model.IsEnd(next))
            {
                continue;
            }

            fixedCost += model.GetFixedCostOfVehicle(v);
            while (!model.IsEnd(index))
            {
                next = solution.Value(model.NextVar(index));
                arcs += mapping.ArcCost(v, index, next);
                index = next;
            }

            long end = model.End(v);
            long duration = solution.Value(time.CumulVar(end)) - solution.Value(time.CumulVar(model.Start(v)));
            span += time.GetSpanCostCoefficientForVehicle(v) * duration;
            overtime += SoftExcess(time, end, solution);
            if (time.HasSoftSpanUpperBounds())
            {
                var bound = time.GetSoftSpanUpperBoundForVehicle(v);
                excess += bound.cost * Math.Max(0, duration - bound.bound);
            }

            for (int d = 0; d < instance.DimensionCount; d++)
            {
                overload += SoftExcess(model.GetMutableDimension("load " + instance.DimensionNames[d]), end, solution);
            }
        }

        var late = new double[instance.StopCount];
        for (int s = 0; s < instance.StopCount; s++)
        {
            long index = mapping.Manager.NodeToIndex(s);
            if (solution.Value(model.NextVar(index)) == index)
            {
                unserved += model.UnperformedPenalty(index);
                continue;
            }

            if (time.HasCumulVarSoftUpperBound(index))
            {
                long over = Math.Max(0, solution.Value(time.CumulVar(index)) - time.GetCumulVarSoftUpperBound(index));
                late[s] = over / scale.TimeScale;
                lateness += time.GetCumulVarSoftUpperBoundCoefficient(index) * over;
            }
        }

        bool byVehicles = instance.Objective == Objective.VehiclesThenDistance;
        var parts = new CostBreakdown
        {
            Fixed = byVehicles ? 0 : scale.ToObjective(fixedCost),
            Vehicles = byVehicles ? scale.ToObjective(fixedCost) : 0,
            Distance = scale.ToObjective(arcs),
            Time = scale.ToObjective(span),
            Lateness = scale.ToObjective(lateness),
            Overload = scale.ToObjective(overload),
            Overtime = scale.ToObjective(overtime),
            DurationExcess = scale.ToObjective(excess),
            Unserved = scale.ToObjective(unserved),
        };
        return new EngineCost(parts, scale.ToObjective(solution.ObjectiveValue()), late);
    }

    /// <summary>The parts side by side with the evaluator's, for the run's notes.</summary>
    public string Compare(CostBreakdown anneal)
    {
        var p = Parts;
        return FormattableString.Invariant(
            $"OR-Tools' own objective {Reported:0.##} against Anneal's {anneal.Total:0.##} for the plan it returned, part by part (OR-Tools/Anneal): ")
            + string.Join(", ", Pairs(p, anneal));
    }

    private static IEnumerable<string> Pairs(CostBreakdown engine, CostBreakdown anneal)
    {
        var parts = new (string Name, double Engine, double Anneal)[]
        {
            ("fixed", engine.Fixed, anneal.Fixed), ("vehicles", engine.Vehicles, anneal.Vehicles),
            ("distance", engine.Distance, anneal.Distance), ("time", engine.Time, anneal.Time),
            ("lateness", engine.Lateness, anneal.Lateness), ("overload", engine.Overload, anneal.Overload),
            ("overtime", engine.Overtime, anneal.Overtime), ("duration excess", engine.DurationExcess, anneal.DurationExcess),
            ("unserved", engine.Unserved, anneal.Unserved),
        };
        foreach (var (name, e, a) in parts)
        {
            if (e != 0 || a != 0)
            {
                yield return FormattableString.Invariant($"{name} {e:0.##}/{a:0.##}");
            }
        }
    }

    private static long SoftExcess(RoutingDimension dimension, long index, Assignment solution) =>
        dimension.HasCumulVarSoftUpperBound(index)
            ? dimension.GetCumulVarSoftUpperBoundCoefficient(index) * Math.Max(0, solution.Value(dimension.CumulVar(index)) - dimension.GetCumulVarSoftUpperBound(index))
            : 0;
}
