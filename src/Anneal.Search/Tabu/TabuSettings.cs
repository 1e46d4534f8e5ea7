using Anneal.Search.Strategy;

namespace Anneal.Search.Tabu;

/// <summary>Tuning of the tabu search; defaults follow Cordeau, Laporte &amp; Mercier (2001) where they give one.</summary>
public sealed record TabuSettings
{
    /// <summary>
    /// What the driver is tuned by. The neighbourhood is smaller than annealing's (tabu evaluates every move each
    /// iteration; measured best at 15); prices move by 1 + 0.5 every iteration; restarts stop at 0.9 of the budget.
    /// </summary>
    public SearchSettings Search { get; init; } = new()
    {
        Neighbours = 15,
        StagnationFraction = 0.15,
        RestartsUntil = 0.9,
        RestartsByPhase = false,
        FleetPatience = 0.25,
        PriceStep = 0.5,
        PolishFrom = null,
    };

    /// <summary>Base tenure is this × log10(n) iterations (Cordeau et al. 2001 use 7.5 log10 n; twice that measured better here); each tenure is drawn from [0.5, 1.5] of it.</summary>
    public double TenureFactor { get; init; } = 15;

    /// <summary>Diversification strength λ (Cordeau et al. 2001 use 0.015).</summary>
    public double Diversification { get; init; } = 0.015;

    /// <summary>At most this many stops are scanned per iteration (a rotating window) so that huge instances still iterate.</summary>
    public int MaxStopsPerIteration { get; init; } = 2500;
}
