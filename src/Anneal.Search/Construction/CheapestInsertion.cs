using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;

namespace Anneal.Search.Construction;

/// <summary>
/// Inserts unserved stops one at a time at their cheapest position next to a granular neighbour, or on an empty
/// route, under the state's penalty weights; droppable stops stay out when inserting would cost more than their
/// penalty. Always returns a plan: when no position is free of violations the cheapest violating one is taken.
/// </summary>
public static class CheapestInsertion
{
    public static void Run(SearchState state, CandidateLists candidates, ReadOnlySpan<int> order, CancellationToken cancel = default)
    {
        var move = default(MoveDraft);
        var best = default(MoveDraft);
        var types = VehicleTypes(state.Instance);
        var seen = new bool[types.Length == 0 ? 0 : types.Max() + 1];
        var pairs = state.Instance.HasPairs ? new PairInsertion(state) : null;
        foreach (int u in order)
        {
            if (cancel.IsCancellationRequested)
            {
                return;
            }

            if (state.RouteOf(u) >= 0)
            {
                continue;
            }

            if (pairs is not null && state.Instance.Partner(u) >= 0 && state.RouteOf(state.Instance.Partner(u)) < 0)
            {
                InsertPair(state, candidates, pairs, u, types, seen);
                continue;
            }

            double bestDelta = double.PositiveInfinity;
            bool routedNeighbour = false;
            foreach (int v in candidates.Of(u))
            {
                if (state.RouteOf(v) < 0)
                {
                    continue;
                }

                routedNeighbour = true;
                Consider(state, ref move, ref best, ref bestDelta, MoveBuilder.Insert(state, ref move, u, v, after: true));
                Consider(state, ref move, ref best, ref bestDelta, MoveBuilder.Insert(state, ref move, u, v, after: false));
            }

            // One empty vehicle of each kind: a refrigerated stop needs a refrigerated van even when box vans are free.
            foreach (int empty in EmptyRoutePerType(state, types, seen))
            {
                Consider(state, ref move, ref best, ref bestDelta, MoveBuilder.Insert(state, ref move, u, -1, false, empty));
            }

            if (!routedNeighbour || bestDelta >= BreakSurcharge)
            {
                // No good position near the stop's neighbours: try every position once.
                for (int r = 0; r < state.RouteCount; r++)
                {
                    for (int p = 0; p < state.Length(r); p++)
                    {
                        Consider(state, ref move, ref best, ref bestDelta, MoveBuilder.Insert(state, ref move, u, state.StopAt(r, p), after: true));
                    }
                }
            }

            bool mayStayOut = state.Instance.MayDrop(u) && (bestDelta >= BreakSurcharge || bestDelta >= 0);
            if (!double.IsPositiveInfinity(bestDelta) && !mayStayOut)
            {
                state.Apply(ref best);
            }
        }
    }

    /// <summary>
    /// Both ends of u's pair at their best positions: on the routes of either end's neighbours and one empty vehicle
    /// of each kind, or on every route when none of those is clean.
    /// </summary>
    private static void InsertPair(SearchState state, CandidateLists candidates, PairInsertion pairs, int u, int[] types, bool[] seen)
    {
        var instance = state.Instance;
        int c = instance.IsCollection(u) ? u : instance.Partner(u);
        int d = instance.Partner(c);
        var best = PairInsertion.Choice.None;
        pairs.ScanNear(c, d, candidates, feasibleOnly: false, ref best);
        foreach (int empty in EmptyRoutePerType(state, types, seen))
        {
            pairs.Scan(c, d, empty, feasibleOnly: false, ref best);
        }

        if (best.Cost >= PairInsertion.BreakSurcharge)
        {
            for (int r = 0; r < state.RouteCount; r++)
            {
                if (!pairs.Scanned(r) && state.Length(r) > 0)
                {
                    pairs.Scan(c, d, r, feasibleOnly: false, ref best);
                }
            }
        }

        double unserved = Core.Evaluation.CostModel.UnservedObjective(instance, c) + Core.Evaluation.CostModel.UnservedObjective(instance, d);
        bool mayStayOut = instance.MayDrop(c) && instance.MayDrop(d) && (best.Cost >= PairInsertion.BreakSurcharge || best.Cost >= unserved);
        if (best.Route >= 0 && !mayStayOut)
        {
            pairs.Apply(c, d, best);
        }
    }

    // A position that breaks no further hard rule always beats one that does, however small the break:
    // any finite price could be undercut by a tiny time warp when a route is dear (vehicles-then-distance).
    private static void Consider(SearchState state, ref MoveDraft move, ref MoveDraft best, ref double bestDelta, bool built)
    {
        if (!built)
        {
            return;
        }

        var parts = state.EvaluateParts(ref move);
        bool breaks = parts.Violation.RouteTotal > 1e-9;
        double d = parts.Penalized(state.Weights) + (breaks ? BreakSurcharge : 0);
        if (d < bestDelta)
        {
            bestDelta = d;
            best = move;
        }
    }

    private const double BreakSurcharge = PairInsertion.BreakSurcharge;

    /// <summary>Vehicles that differ in nothing a route's cost or feasibility depends on share a type number.</summary>
    public static int[] VehicleTypes(Core.Model.Instance instance)
    {
        var keys = new Dictionary<string, int>(StringComparer.Ordinal);
        var types = new int[instance.Vehicles.Count];
        for (int v = 0; v < types.Length; v++)
        {
            var x = instance.Vehicles[v];
            string key = string.Join('|', x.StartDepot, x.EndDepot, string.Join(',', x.Capacity), x.ShiftStart, x.ShiftEnd, x.MaxDuration, x.FixedCost, x.CostPerDistance, x.CostPerHour, x.Equipment);
            if (!keys.TryGetValue(key, out int t))
            {
                t = keys.Count;
                keys[key] = t;
            }

            types[v] = t;
        }

        return types;
    }

    private static List<int> EmptyRoutePerType(SearchState state, int[] types, bool[] seen)
    {
        Array.Clear(seen);
        var found = new List<int>();
        for (int r = 0; r < state.RouteCount && found.Count < seen.Length; r++)
        {
            if (state.Length(r) == 0 && !seen[types[r]])
            {
                seen[types[r]] = true;
                found.Add(r);
            }
        }

        return found;
    }

    /// <summary>An unused vehicle, or -1 when every vehicle has a route.</summary>
    public static int FirstEmptyRoute(SearchState state)
    {
        for (int r = 0; r < state.RouteCount; r++)
        {
            if (state.Length(r) == 0)
            {
                return r;
            }
        }

        return -1;
    }

    /// <summary>Stops needing equipment first, then the farthest from the depot: they are the hardest to fit late (common practice for seeding).</summary>
    public static int[] FarthestFirst(Core.Model.Instance instance)
    {
        int n = instance.StopCount;
        var order = new int[n];
        var key = new double[n];
        int depot = instance.Depots.Count > 0 ? instance.DepotLocation(0) : 0;
        for (int i = 0; i < n; i++)
        {
            order[i] = i;
            // Stops that need equipment go first, while the few vehicles that have it still have room.
            key[i] = -instance.Travel.Distance(depot, i) - (instance.Stops[i].Needs != 0 ? 1e12 : 0);
        }

        Array.Sort(key, order);
        return order;
    }
}
