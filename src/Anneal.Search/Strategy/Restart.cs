using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>What a search does when it stagnates: go back to the best plan and, when vehicles cost, try with one route fewer.</summary>
public static class Restart
{
    public static void FromBest(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, bool eliminateRoute, Random rng)
    {
        keeper.Restore(state);
        if (eliminateRoute && keeper.HasFeasible)
        {
            keeper.Reset(state, rng, EmptyAShortRoute);
        }

        state.SetWeights(adapter.Weights);
    }

    /// <summary>
    /// Closes the fleet phase's last attempt: the running attempt is repaired, and the search goes back to the best
    /// plan. True when the repair gave a new best. The caller then begins the distance phase.
    /// </summary>
    public static bool Settle(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, CandidateLists candidates, Random rng)
    {
        bool improved = Repair(state, keeper, adapter, candidates);
        FromBest(state, keeper, adapter, false, rng);
        return improved;
    }

    /// <summary>
    /// What to do when the search stalls: in the distance phase go back to the best; in the fleet phase repair the
    /// attempt and start the next one. True when the repair gave a new best.
    /// </summary>
    public static bool AfterStall(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, CandidateLists candidates, FleetPhase phase, double progress, Random rng)
    {
        if (!phase.Eliminating)
        {
            FromBest(state, keeper, adapter, false, rng);
            return false;
        }

        bool improved = Repair(state, keeper, adapter, candidates);
        if (improved)
        {
            phase.NewBest(state, progress);
        }

        NextAttempt(state, keeper, adapter, phase.FewestRoutes, rng);
        return improved;
    }

    /// <summary>
    /// The next route-elimination attempt, after <see cref="Repair"/>: from the repaired plan when it is feasible on
    /// no more routes than the best (its routes kept improving while the attempt ran), else from the best; then one
    /// route is emptied.
    /// </summary>
    private static void NextAttempt(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, int fewestRoutes, Random rng)
    {
        if (!state.Feasible || state.UsedRoutes > fewestRoutes)
        {
            keeper.Restore(state);
        }

        // A feasible state was just offered (Repair), so the keeper has a feasible plan whenever the state is kept.
        if (keeper.HasFeasible)
        {
            keeper.Reset(state, rng, EmptyAShortRoute);
        }

        state.SetWeights(adapter.Weights);
    }

    /// <summary>
    /// Ends a stalled route-elimination attempt without throwing its work away: the stops still unserved are put
    /// back by cheapest insertion under construction prices (opening a route if need be) and the result is offered
    /// as a best. True when it is one.
    /// </summary>
    public static bool Repair(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, CandidateLists candidates)
    {
        keeper.Reset(state, (adapter, candidates), static (s, a) =>
        {
            if (s.UnservedCount > 0)
            {
                var pool = new int[s.UnservedCount];
                for (int k = 0; k < pool.Length; k++)
                {
                    pool[k] = s.UnservedAt(k);
                }

                s.SetWeights(InitialWeights.ForConstruction(s.Instance));
                CheapestInsertion.Run(s, a.candidates, pool);
            }

            s.SetWeights(a.adapter.Weights);
        });
        return keeper.Offer(state);
    }

    private static void EmptyAShortRoute(SearchState state, Random rng) => RouteElimination.EmptyAShortRoute(state, rng);
}
