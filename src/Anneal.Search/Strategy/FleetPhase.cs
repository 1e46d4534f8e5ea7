using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Splits a run in which vehicles cost into two phases: first routes are eliminated, then, with the fleet fixed,
/// distance gets a cooling schedule of its own over the rest of the budget. Without the split the few routes are
/// found late and the distance is only polished cold. The fleet phase ends at a share of the budget, or earlier
/// when no plan with fewer routes has turned up for a while. Runs where vehicles are free have one phase.
/// </summary>
public sealed class FleetPhase
{
    private readonly double _patience;
    private readonly double _deadline;
    private double _lastFewerAt;
    private int _fewestRoutes = int.MaxValue;

    private readonly bool _reduceVehicles;

    public FleetPhase(bool reduceVehicles, double share, double patience)
    {
        _reduceVehicles = reduceVehicles;
        Eliminating = reduceVehicles;
        _deadline = reduceVehicles ? share : 1;
        End = _deadline;
        _patience = patience;
    }

    /// <summary>Fewest routes of a feasible best plan seen in the fleet phase.</summary>
    public int FewestRoutes => _fewestRoutes;

    /// <summary>True while the search still tries to use fewer routes.</summary>
    public bool Eliminating { get; private set; }

    /// <summary>
    /// True in the distance phase of a run where vehicles cost: the fleet of the best plan is then held. Violations
    /// are priced above a vehicle by then, so opening a route to cure one would let the current plan drift onto more
    /// routes than the best, and emptying a route while breaking a rule gains a vehicle that outweighs any price and
    /// would strand it on too few (both measured on the 1,000-stop Gehring-Homberger files).
    /// </summary>
    public bool HoldsFleet => _reduceVehicles && !Eliminating;

    /// <summary>
    /// Does holding the fleet refuse this move? A route may be opened only by a move that lowers the objective and
    /// breaks no rule; one may be emptied only by a move that breaks no rule.
    /// </summary>
    public static bool Refuses(bool opensRoute, bool emptiesRoute, bool feasibleAfter, double objectiveChange) =>
        opensRoute ? !(feasibleAfter && objectiveChange < 0) : emptiesRoute && !feasibleAfter;

    /// <summary>Budget progress at which the current phase began.</summary>
    public double Start { get; private set; }

    /// <summary>
    /// Budget progress at which the current phase's schedule ends. The fleet phase cools fully by its share of the
    /// budget: the last routes go only when the search is cold (measured on the 1,000-stop Gehring-Homberger files).
    /// </summary>
    public double End { get; private set; }

    /// <summary>How far through the current phase the run is, 0 to 1, for the phase's own schedules.</summary>
    public double Within(double progress) => Math.Clamp((progress - Start) / Math.Max(1e-9, End - Start), 0, 1);

    /// <summary>Call on every new best plan: notes when the fleet last shrank.</summary>
    public void NewBest(SearchState state, double progress)
    {
        if (!Eliminating || !state.Feasible)
        {
            return;
        }

        int used = state.UsedRoutes;
        if (used < _fewestRoutes)
        {
            _fewestRoutes = used;
            _lastFewerAt = progress;
        }
    }

    /// <summary>True when the fleet phase should give way to the distance phase now.</summary>
    public bool Due(double progress) => Eliminating && (progress >= _deadline || progress - _lastFewerAt > _patience);

    /// <summary>Starts the distance phase at this progress.</summary>
    public void BeginDistance(double progress)
    {
        Eliminating = false;
        Start = progress;
        End = 1;
    }
}
