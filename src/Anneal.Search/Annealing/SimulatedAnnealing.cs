using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Search.Running;
using Anneal.Search.Strategy;

namespace Anneal.Search.Annealing;

/// <summary>
/// Simulated annealing (Kirkpatrick, Gelatt &amp; Vecchi 1983; for routing Osman 1993, Chiang &amp; Russell 1996)
/// over the granular neighbourhoods, seeded by cheapest insertion and driven by <see cref="PhasedSearch"/>. The
/// start temperature is calibrated from sampled move deltas; cooling is geometric in the fraction of the phase
/// used, so a 10 s and a 10 min run both finish cold; a restart reheats; with the fleet held, string ruins
/// (<see cref="StringRuin"/>) join the plain moves and the search keeps to the hard rules (<see cref="AnnealingStep"/>).
/// </summary>
public sealed class SimulatedAnnealing : SeededSearch
{
    private readonly AnnealingSettings _settings;

    public SimulatedAnnealing(AnnealingSettings? settings = null)
    {
        _settings = settings ?? new AnnealingSettings();
    }

    public override string Name => "sa";

    public override string? Declines(Instance instance) => null;

    protected override SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel) =>
        PhasedSearch.Run(Name, instance, options, _settings.Search, run => new AnnealingStep(run, _settings), progress, cancel);
}
