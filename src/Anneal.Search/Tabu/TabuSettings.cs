namespace Anneal.Search.Tabu;

/// <summary>Tuning of the tabu search; defaults follow Cordeau, Laporte &amp; Mercier (2001) where they give one.</summary>
public sealed record TabuSettings
{
    /// <summary>Granular neighbourhood size k (smaller than annealing's: tabu evaluates every move each iteration; measured best at 15).</summary>
    public int Neighbours { get; init; } = 15;

    /// <summary>Base tenure is this × log10(n) iterations (Cordeau et al. 2001 use 7.5 log10 n; twice that measured better here); each tenure is drawn from [0.5, 1.5] of it.</summary>
    public double TenureFactor { get; init; } = 15;

    /// <summary>Penalty weights are multiplied or divided by 1 + delta each iteration.</summary>
    public double PenaltyDelta { get; init; } = 0.5;

    /// <summary>Diversification strength λ (Cordeau et al. 2001 use 0.015).</summary>
    public double Diversification { get; init; } = 0.015;

    /// <summary>Fraction of the budget without a new best after which the search restarts from the best plan.</summary>
    public double StagnationFraction { get; init; } = 0.15;

    /// <summary>
    /// Share of the budget the ejection pool may spend removing routes from the constructed plan when vehicles cost
    /// (a quarter of it at the close of the fleet phase instead, when the constructed plan broke a hard rule).
    /// </summary>
    public double SqueezeShare { get; init; } = 0.4;

    /// <summary>Share of the budget the ejection pool may spend on one route in vain before it gives up.</summary>
    public double SqueezePatience { get; init; } = 0.05;

    /// <summary>Largest share of the budget spent eliminating routes when vehicles cost (as for annealing).</summary>
    public double FleetShare { get; init; } = 0.6;

    /// <summary>Share of the budget without a plan on fewer routes after which route elimination stops early.</summary>
    public double FleetPatience { get; init; } = 0.25;

    /// <summary>At most this many stops are scanned per iteration (a rotating window) so that huge instances still iterate.</summary>
    public int MaxStopsPerIteration { get; init; } = 2500;
}
