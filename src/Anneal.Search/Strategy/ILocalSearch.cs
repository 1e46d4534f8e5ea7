namespace Anneal.Search.Strategy;

/// <summary>What one step of a local search did.</summary>
public enum StepResult
{
    /// <summary>The state changed; the driver offers it to the best keeper.</summary>
    Moved,

    /// <summary>Nothing changed (no move drawn, or the move refused).</summary>
    Skipped,

    /// <summary>The search has nothing left to do; the run ends.</summary>
    Stopped,
}

/// <summary>
/// A local search as <see cref="PhasedSearch"/> drives it: the driver owns the budget, the best plan, the phases
/// (ejection-pool opening, route elimination and its squeeze, the distance phase on a held fleet, the polish),
/// restarts, prices, trace and target; the search supplies its step and its reactions to the driver's events.
/// Every change of the state goes through <see cref="SearchRun.Keeper"/>.
/// </summary>
public interface ILocalSearch
{
    SearchRhythm Rhythm { get; }

    /// <summary>The search's state in a few words for the trace (e.g. "T=12.5").</summary>
    string Note { get; }

    /// <summary>Once, on the constructed plan, before the opening.</summary>
    void Begin();

    /// <summary>One iteration.</summary>
    StepResult Step(long iteration);

    /// <summary>At every check, after its phase changes: progress through the budget and through the current phase.</summary>
    void OnCheck(double progress, double withinPhase);

    /// <summary>The distance phase or the polish began; the state holds the best plan.</summary>
    void OnPhase(SearchPhase phase);

    /// <summary>A restart on stagnation put the best plan (or the next route-elimination attempt) in the state.</summary>
    void OnRestart();
}

/// <summary>The phases a run may go through after its opening.</summary>
public enum SearchPhase
{
    /// <summary>Distance on the fleet the fleet phase settled (or the whole run when vehicles are free).</summary>
    Distance,

    /// <summary>The last share of a held-fleet phase, from the best plan (<see cref="SearchSettings.PolishFrom"/>).</summary>
    Polish,
}
