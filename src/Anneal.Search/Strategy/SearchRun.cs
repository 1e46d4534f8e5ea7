using Anneal.Core.Solving;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>What a local search works with while <see cref="PhasedSearch"/> drives it.</summary>
public sealed class SearchRun(SearchStart start, BestKeeper keeper, FleetPhase phase, PenaltyAdapter prices, SearchRandom random, SearchSettings settings, SolveOptions options)
{
    public SearchState State => start.State;

    public CandidateLists Candidates => start.Candidates;

    public Budget Budget => start.Budget;

    public BestKeeper Keeper => keeper;

    public FleetPhase Phase => phase;

    public PenaltyAdapter Prices => prices;

    /// <summary>The run's one random source: every draw of the search and of the driver comes from it, in order.</summary>
    public SearchRandom Random => random;

    public SearchSettings Settings => settings;

    public SolveOptions Options => options;

    /// <summary>The best plan's fleet is held now: the distance phase of a run where vehicles cost, once a feasible plan is known.</summary>
    public bool HoldsFleet => phase.HoldsFleet && keeper.HasFeasible;
}
