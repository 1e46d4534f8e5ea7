using Anneal.Core.Model;
using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>
/// Maps an Anneal instance onto an OR-Tools routing model: every rule either exactly (up to
/// <see cref="IntegerScale"/>) or with an "approximated: ..." note — never silently dropped.
/// </summary>
public static class RoutingModelBuilder
{
    public const string TimeDimension = "time";

    /// <summary>
    /// Up to this many nodes travel goes to OR-Tools as matrices (fastest to search); above it as callbacks over
    /// Anneal's travel table, since each matrix costs 8 bytes per arc twice over (managed and native): 1.6 GB per
    /// matrix at 10,000 stops. Measured in the notes of issue 18.
    /// </summary>
    public const int MatrixLimit = 2000;

    public static RoutingMapping Build(Instance instance, int matrixLimit = MatrixLimit)
    {
        var scale = new IntegerScale(instance);
        ScalingGuard.Ensure(instance, scale);
        var notes = new List<string>(ScheduleApproximations.For(instance));
        int n = instance.StopCount;
        var nodeLocation = NodeLocations(instance);
        int vehicles = instance.Vehicles.Count;
        var starts = new int[vehicles];
        var ends = new int[vehicles];
        for (int v = 0; v < vehicles; v++)
        {
            starts[v] = Array.IndexOf(nodeLocation, instance.DepotLocation(instance.Vehicles[v].StartDepot));
            ends[v] = Array.IndexOf(nodeLocation, instance.DepotLocation(instance.Vehicles[v].EndDepot));
        }

        var manager = new RoutingIndexManager(nodeLocation.Length, vehicles, starts, ends);
        var model = new RoutingModel(manager);
        var travel = new TravelCallbacks(model, manager, nodeLocation, nodeLocation.Length <= matrixLimit);
        var arcCost = ArcCosts(instance, scale, model, travel);
        Time(instance, scale, model, manager, travel);
        Loads(instance, scale, model, manager, nodeLocation, notes);
        for (int v = 0; v < vehicles; v++)
        {
            model.SetFixedCostOfVehicle(scale.Cost(instance.Costs.Rates(v).Fixed), v);
        }

        Visits(instance, scale, model, manager, notes);
        Pairs(instance, model, manager);
        notes.AddRange(scale.Notes);
        return new RoutingMapping(instance, scale, manager, model, travel, arcCost, notes);
    }

    /// <summary>Stops, then each depot some vehicle starts or ends at.</summary>
    private static int[] NodeLocations(Instance instance)
    {
        var nodes = new List<int>();
        for (int s = 0; s < instance.StopCount; s++)
        {
            nodes.Add(s);
        }

        for (int d = 0; d < instance.Depots.Count; d++)
        {
            bool used = false;
            foreach (var v in instance.Vehicles)
            {
                used |= v.StartDepot == d || v.EndDepot == d;
            }

            if (used)
            {
                nodes.Add(instance.DepotLocation(d));
            }
        }

        return nodes.ToArray();
    }

    /// <summary>
    /// Arc cost = distance × the vehicle's price per distance (1 outside the cost objective); one matrix or callback
    /// per distinct price. Returns each vehicle's arc cost of locations, as registered.
    /// </summary>
    private static Func<int, int, long>[] ArcCosts(Instance instance, IntegerScale scale, RoutingModel model, TravelCallbacks travel)
    {
        var byRate = new Dictionary<double, (int Callback, Func<int, int, long> Cost)>();
        var costs = new Func<int, int, long>[instance.Vehicles.Count];
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            double rate = instance.Objective == Objective.Cost ? instance.Vehicles[v].CostPerDistance : 1;
            if (!byRate.TryGetValue(rate, out var registered))
            {
                Func<int, int, long> cost = (a, b) =>
                    a == b || (a >= instance.StopCount && b >= instance.StopCount) ? 0 : scale.Cost(instance.Travel.Distance(a, b) * rate);
                registered = (travel.Register(cost), cost);
                byRate[rate] = registered;
            }

            model.SetArcCostEvaluatorOfVehicle(registered.Callback, v);
            costs[v] = registered.Cost;
        }

        return costs;
    }

    /// <summary>Service start times: shifts, windows (hard ranges or soft upper bounds), per-hour cost, maximum duration.</summary>
    private static void Time(Instance instance, IntegerScale scale, RoutingModel model, RoutingIndexManager manager, TravelCallbacks travel)
    {
        int callback = travel.Register(scale.Transit);
        model.AddDimension(callback, scale.Horizon, scale.Horizon, false, TimeDimension);
        var time = model.GetMutableDimension(TimeDimension);
        var rules = instance.Rules;
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            var vehicle = instance.Vehicles[v];
            long start = scale.TimeUp(vehicle.ShiftStart);
            long latest = rules.ShiftEnd.Hard ? scale.TimeDown(vehicle.ShiftEnd) : scale.Horizon;
            time.CumulVar(model.Start(v)).SetRange(start, Math.Max(start, latest));
            if (!double.IsPositiveInfinity(vehicle.ShiftEnd))
            {
                if (rules.ShiftEnd.Hard)
                {
                    time.CumulVar(model.End(v)).SetMax(scale.TimeDown(vehicle.ShiftEnd));
                }
                else
                {
                    time.SetCumulVarSoftUpperBound(model.End(v), scale.TimeNearest(vehicle.ShiftEnd), scale.PerTimeStep(rules.ShiftEnd.Price, "overtime price"));
                }
            }

            if (instance.Costs.Rates(v).PerTime is > 0 and var hourly)
            {
                time.SetSpanCostCoefficientForVehicle(scale.PerTimeStep(hourly, "cost per hour"), v);
            }

            if (!double.IsPositiveInfinity(vehicle.MaxDuration))
            {
                if (rules.MaxDuration.Hard)
                {
                    time.SetSpanUpperBoundForVehicle(scale.DurationDown(vehicle.MaxDuration), v);
                }
                else
                {
                    time.SetSoftSpanUpperBoundForVehicle(new BoundCost(scale.DurationNearest(vehicle.MaxDuration), scale.PerTimeStep(rules.MaxDuration.Price, "price per time over the maximum duration")), v);
                }
            }
        }

        for (int s = 0; s < instance.StopCount; s++)
        {
            Windows(instance, scale, time, manager.NodeToIndex(s), instance.Stops[s].Windows);
        }
    }

    /// <summary>
    /// Hard: the hull of the windows as the cumul range, the gaps removed. Soft: the same from the first opening,
    /// with lateness past the last close priced per time step (Anneal waits in a gap and is late only after the last window).
    /// </summary>
    private static void Windows(Instance instance, IntegerScale scale, RoutingDimension time, long index, TimeWindow[] windows)
    {
        var cumul = time.CumulVar(index);
        bool hard = instance.Rules.TimeWindows.Hard;
        long open = scale.TimeUp(windows[0].Open);
        long close = hard ? scale.TimeDown(windows[^1].Close) : scale.Horizon;
        cumul.SetRange(open, Math.Max(open, close));
        for (int w = 0; w + 1 < windows.Length; w++)
        {
            long gapFrom = scale.TimeDown(windows[w].Close) + 1;
            long gapTo = scale.TimeUp(windows[w + 1].Open) - 1;
            if (gapFrom <= gapTo)
            {
                cumul.RemoveInterval(gapFrom, gapTo);
            }
        }

        if (!hard && !double.IsPositiveInfinity(windows[^1].Close))
        {
            time.SetCumulVarSoftUpperBound(index, scale.TimeNearest(windows[^1].Close), scale.PerTimeStep(instance.Rules.TimeWindows.Price, "lateness price"));
        }
    }

    /// <summary>
    /// One dimension per demand dimension. Delivery only: everything is loaded at the start, so the cumul counts what
    /// has been delivered and the end cumul is the route's load. With pickups the cumul is the load on board: each
    /// stop adds what it collects and takes off what it delivers, and the start cumul (free) is pinned to the route's
    /// deliveries from the depot, which a second dimension adds up, so capacity holds at every stop.
    /// </summary>
    private static void Loads(Instance instance, IntegerScale scale, RoutingModel model, RoutingIndexManager manager, int[] nodeLocation, List<string> notes)
    {
        var rules = instance.Rules;
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            var change = new long[nodeLocation.Length];
            var fromDepot = new long[nodeLocation.Length];
            long total = 0;
            bool depotLoads = false;
            for (int node = 0; node < instance.StopCount; node++)
            {
                long demand = scale.DemandUp(instance.Demand(node, d));
                fromDepot[node] = scale.DemandUp(instance.DepotLoad(node, d));
                depotLoads |= fromDepot[node] > 0;
                change[node] = instance.HasPickups ? scale.DemandUp(instance.Pickup(node, d)) - demand : demand;
                total += demand + scale.DemandUp(instance.Pickup(node, d));
            }

            var capacity = new long[instance.Vehicles.Count];
            for (int v = 0; v < capacity.Length; v++)
            {
                capacity[v] = rules.Capacity.Hard ? scale.CapacityDown(instance.Capacity(v, d)) : total + 1;
            }

            string name = "load " + instance.DimensionNames[d];
            bool pinned = instance.HasPickups && depotLoads;
            model.AddDimensionWithVehicleCapacity(model.RegisterUnaryTransitVector(change), 0, capacity, !pinned, name);
            var load = model.GetMutableDimension(name);
            if (pinned)
            {
                string carried = "from depot " + instance.DimensionNames[d];
                model.AddDimension(model.RegisterUnaryTransitVector(fromDepot), 0, total + 1, true, carried);
                var depot = model.GetMutableDimension(carried);
                var solver = model.solver();
                for (int v = 0; v < capacity.Length; v++)
                {
                    solver.Add(solver.MakeEquality(load.CumulVar(model.Start(v)), depot.CumulVar(model.End(v))));
                }
            }

            if (rules.Capacity.Hard)
            {
                continue;
            }

            long price = scale.PerLoadStep(rules.Capacity.Price, "overload price");
            for (int v = 0; v < capacity.Length; v++)
            {
                if (!double.IsPositiveInfinity(instance.Capacity(v, d)))
                {
                    long limit = scale.LoadNearest(instance.Capacity(v, d));
                    load.SetCumulVarSoftUpperBound(instance.HasPickups ? model.Start(v) : model.End(v), limit, price);
                }
            }

            if (instance.HasPickups)
            {
                for (int node = 0; node < instance.StopCount; node++)
                {
                    long index = manager.NodeToIndex(node);
                    load.SetCumulVarSoftUpperBound(index, scale.LoadNearest(instance.Capacity(0, d)), price);
                }

                notes.Add("approximated: with pickups a soft capacity is priced at every stop where the load is over (of the first vehicle's capacity), not once at the fullest point");
            }
        }
    }

    /// <summary>Each collect-and-deliver pair: one vehicle, collection first (the library's pickup-and-delivery constraint), both served or neither.</summary>
    private static void Pairs(Instance instance, RoutingModel model, RoutingIndexManager manager)
    {
        if (!instance.HasPairs)
        {
            return;
        }

        var solver = model.solver();
        var time = model.GetMutableDimension(TimeDimension);
        for (int d = 0; d < instance.StopCount; d++)
        {
            int c = instance.Stops[d].CollectFrom;
            if (c < 0)
            {
                continue;
            }

            long collect = manager.NodeToIndex(c);
            long deliver = manager.NodeToIndex(d);
            model.AddPickupAndDelivery(collect, deliver);
            solver.Add(solver.MakeEquality(model.VehicleVar(collect), model.VehicleVar(deliver)));
            solver.Add(solver.MakeEquality(model.ActiveVar(collect), model.ActiveVar(deliver)));
            solver.Add(solver.MakeLessOrEqual(time.CumulVar(collect), time.CumulVar(deliver)));
        }
    }

    /// <summary>Stops that may be left out become disjunctions with their penalty; needed equipment restricts the vehicle variable.</summary>
    private static void Visits(Instance instance, IntegerScale scale, RoutingModel model, RoutingIndexManager manager, List<string> notes)
    {
        for (int s = 0; s < instance.StopCount; s++)
        {
            long index = manager.NodeToIndex(s);
            var allowed = new List<long> { -1 };
            ulong needs = instance.Stops[s].Needs;
            for (int v = 0; v < instance.Vehicles.Count; v++)
            {
                if ((needs & ~instance.Vehicles[v].Equipment) == 0)
                {
                    allowed.Add(v);
                }
            }

            bool noVehicle = allowed.Count == 1;
            if (instance.MayDrop(s) || noVehicle)
            {
                model.AddDisjunction([index], scale.Cost(instance.UnservedPrice(s)));
            }

            if (noVehicle)
            {
                notes.Add($"stop {instance.Stops[s].Id} needs equipment no vehicle carries; it is left unserved");
            }

            // SetAllowedVehiclesForIndex takes an absl::Span the C# wrapper cannot build; restricting the vehicle
            // variable is the same constraint (-1 = unserved, which disjunction-free stops exclude anyway).
            if (allowed.Count <= instance.Vehicles.Count)
            {
                model.VehicleVar(index).SetValues(allowed.ToArray());
            }
        }
    }
}
