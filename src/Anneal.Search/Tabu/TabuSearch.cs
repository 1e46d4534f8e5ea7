using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Search.Running;
using Anneal.Search.Strategy;

namespace Anneal.Search.Tabu;

/// <summary>
/// Tabu search after the unified tabu search of Cordeau, Laporte &amp; Mercier (2001), driven by
/// <see cref="PhasedSearch"/>: each iteration takes the best admissible move of the granular neighbourhood
/// (<see cref="TabuStep"/>); attributes (stop, route) are tabu for a randomised tenure; aspiration by best cost;
/// hard-rule prices adapt by (1 + delta) each iteration; non-improving moves pay for attributes used often.
/// </summary>
public sealed class TabuSearch : SeededSearch
{
    private readonly TabuSettings _settings;

    public TabuSearch(TabuSettings? settings = null)
    {
        _settings = settings ?? new TabuSettings();
    }

    public override string Name => "tabu";

    public override string? Declines(Instance instance) => null;

    protected override SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel) =>
        PhasedSearch.Run(Name, instance, options, _settings.Search, run => new TabuStep(run, _settings), progress, cancel);
}
