using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>What a search does when it stagnates: go back to the best plan and, when vehicles cost, try with one route fewer.</summary>
public static class Restart
{
    public static void FromBest(SearchState state, BestKeeper keeper, PenaltyAdapter adapter, bool eliminateRoute, Random rng)
    {
        keeper.BeforeReset(state);
        keeper.Restore(state);
        if (eliminateRoute && keeper.HasFeasible)
        {
            keeper.BeforeReset(state);
            RouteElimination.EmptySmallest(state, rng);
        }

        state.SetWeights(adapter.Weights);
    }
}
