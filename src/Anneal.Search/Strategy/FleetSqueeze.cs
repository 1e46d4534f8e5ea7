using Anneal.Search.Randomness;
using Anneal.Core.Solving;

namespace Anneal.Search.Strategy;

/// <summary>
/// Runs the ejection pool against a share of the budget: routes are removed one at a time from the best feasible
/// plan, each removal persisting until it succeeds, the share is spent, or <c>patience</c> of the budget has gone
/// without one. A run where vehicles cost opens with it (<see cref="Opening"/>); when the constructed plan broke a
/// hard rule it runs instead at the close of the fleet phase. Work is counted in iterations, so an iteration-bound
/// run stays reproducible.
/// </summary>
public static class FleetSqueeze
{
    /// <summary>
    /// Runs from <paramref name="iteration"/> until a further <paramref name="share"/> of the budget is used or
    /// <paramref name="patience"/> of it has passed without a removal; returns the iteration count reached, with
    /// <paramref name="workPerIteration"/> route evaluations counted as one of the caller's iterations. The state
    /// holds the best plan afterwards.
    /// </summary>
    public static long Run(SearchStart start, BestKeeper keeper, FleetPhase phase, SearchRandom rng, long iteration, double share, double patience, long workPerIteration)
    {
        var (budget, trace, candidates, state) = start;
        if (!phase.Eliminating || !keeper.HasFeasible || share <= 0)
        {
            return iteration;
        }

        var pool = new EjectionPool(state, candidates, rng);
        long first = iteration;
        long work = 0;
        double end = Math.Min(1, budget.Progress(iteration) + share);
        double lastSuccess = budget.Progress(iteration);
        while (!Over(budget, iteration, end))
        {
            keeper.Restore(state);
            int route = RandomUsedRoute(state, rng);
            if (route < 0)
            {
                break;
            }

            keeper.Reset(state, (pool, route), static (_, a) => a.pool.Begin(a.route));
            double limit = Math.Min(end, lastSuccess + patience);
            while (pool.Waiting > 0 && !Over(budget, iteration, limit))
            {
                work += pool.Step();
                iteration = first + (work / workPerIteration);
            }

            if (pool.Waiting > 0 || !keeper.Offer(state))
            {
                break;
            }

            lastSuccess = budget.Progress(iteration);
            phase.NewBest(state, lastSuccess);
            trace.Improved(new TracePoint(budget.Elapsed, iteration, keeper.Objective, state.Objective, true, $"ejection pool: {state.UsedRoutes} routes"));
        }

        keeper.Restore(state);
        return iteration;
    }

    /// <summary>
    /// The squeeze as a run's opening, from the constructed plan: when it ran, the fleet phase is over and the
    /// distance phase begins where it stopped, at <paramref name="iteration"/>. False when there was nothing to
    /// squeeze (vehicles are free, or the constructed plan breaks a hard rule); the fleet phase then goes on.
    /// </summary>
    public static bool Opening(SearchStart start, BestKeeper keeper, FleetPhase phase, SearchRandom rng, double share, double patience, long workPerIteration, out long iteration)
    {
        iteration = Run(start, keeper, phase, rng, 0, share, patience, workPerIteration);
        if (iteration == 0)
        {
            return false;
        }

        phase.BeginDistance(start.Budget.Progress(iteration));
        return true;
    }

    private static bool Over(Budget budget, long iteration, double end) =>
        budget.Cancelled || budget.Progress(iteration) >= end || budget.Exhausted(iteration);

    private static int RandomUsedRoute(Representation.SearchState state, SearchRandom rng)
    {
        int used = state.UsedRoutes;
        if (used <= 1)
        {
            return -1;
        }

        int pick = rng.Next(used);
        for (int r = 0; r < state.RouteCount; r++)
        {
            if (state.Length(r) > 0 && pick-- == 0)
            {
                return r;
            }
        }

        return -1;
    }
}
