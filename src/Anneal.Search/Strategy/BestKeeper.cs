using Anneal.Core.Plans;
using Anneal.Search.Moves;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Keeps the best plan seen: any feasible plan beats every infeasible one, then the lower objective. Copies lazily:
/// while the current state is the best, the copy is made only before a change that might lose it, which is why
/// every change of the state goes through the keeper (<see cref="Apply"/>, <see cref="Reset"/>, <see cref="Restore"/>).
/// </summary>
public sealed class BestKeeper
{
    private readonly int[] _lengths;
    private readonly int[][] _stops;
    private bool _pending;
    private bool _hasSnapshot;

    public BestKeeper(SearchState state)
    {
        _lengths = new int[state.RouteCount];
        _stops = new int[state.RouteCount][];
        for (int r = 0; r < _stops.Length; r++)
        {
            _stops[r] = new int[8];
        }

        Offer(state);
    }

    public bool HasFeasible { get; private set; }

    /// <summary>Objective of the best plan (feasible if any was found).</summary>
    public double Objective { get; private set; } = double.PositiveInfinity;

    private double _bestInfeasible = double.PositiveInfinity;

    /// <summary>Call after every applied move; returns true when the state became the new best.</summary>
    public bool Offer(SearchState state)
    {
        if (state.Feasible)
        {
            double obj = state.Objective;
            if (!HasFeasible || obj < Objective - 1e-9)
            {
                HasFeasible = true;
                Objective = obj;
                _pending = true;
                return true;
            }
        }
        else if (!HasFeasible && state.Penalized < _bestInfeasible - 1e-9)
        {
            _bestInfeasible = state.Penalized;
            Objective = state.Objective;
            _pending = true;
            return true;
        }

        return false;
    }

    /// <summary>
    /// Applies a move, first copying the best plan away unless the move is certain to improve on it (the state may
    /// hold the best, and the move would lose it).
    /// </summary>
    public void Apply(SearchState state, ref MoveDraft move, in MoveEffect effect)
    {
        if (_pending)
        {
            bool certainlyBetter = HasFeasible
                ? effect.FeasibleAfter && effect.Objective < -1e-9
                : effect.FeasibleAfter || effect.Penalized < -1e-9;
            if (!certainlyBetter)
            {
                Snapshot(state);
            }
        }

        state.Apply(ref move);
    }

    /// <summary>
    /// Changes the state other than by one move (a ruin, an emptied route, a repair), first copying the best plan
    /// away if the state holds it. A change of prices alone needs none of this.
    /// </summary>
    public void Reset<T>(SearchState state, T argument, Action<SearchState, T> change)
    {
        SnapshotIfHeld(state);
        change(state, argument);
    }

    /// <summary>Puts the best plan back into the state (a restart from the best).</summary>
    public void Restore(SearchState state)
    {
        SnapshotIfHeld(state);
        if (_pending)
        {
            return;
        }

        state.Load(BestPlan(state));
        _pending = true;
    }

    private void SnapshotIfHeld(SearchState state)
    {
        if (_pending)
        {
            Snapshot(state);
        }
    }

    private void Snapshot(SearchState state)
    {
        state.CopyTo(_lengths, _stops);
        _pending = false;
        _hasSnapshot = true;
    }

    public Plan BestPlan(SearchState state)
    {
        if (_pending || !_hasSnapshot)
        {
            return state.ToPlan();
        }

        var routes = new List<PlannedRoute>();
        for (int r = 0; r < _lengths.Length; r++)
        {
            if (_lengths[r] > 0)
            {
                routes.Add(new PlannedRoute(r, _stops[r].AsSpan(0, _lengths[r]).ToArray()));
            }
        }

        return new Plan(routes);
    }
}
