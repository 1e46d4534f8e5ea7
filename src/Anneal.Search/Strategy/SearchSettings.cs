namespace Anneal.Search.Strategy;

/// <summary>
/// What every phased local search is tuned by (<see cref="PhasedSearch"/>): the neighbourhood, the fleet phase and
/// its squeeze, restarts on stagnation, the adaptive prices and the polish. Each solver starts from its own
/// measured values (<c>AnnealingSettings.Search</c>, <c>TabuSettings.Search</c>).
/// </summary>
public sealed record SearchSettings
{
    /// <summary>Granular neighbourhood size k.</summary>
    public int Neighbours { get; init; } = 30;

    /// <summary>Fraction of the budget without a new best after which the search restarts (half of it while eliminating routes).</summary>
    public double StagnationFraction { get; init; } = 0.12;

    /// <summary>No restart on stagnation once this share is reached, of the current phase or of the whole budget (<see cref="RestartsByPhase"/>).</summary>
    public double RestartsUntil { get; init; } = 0.85;

    /// <summary>Whether <see cref="RestartsUntil"/> is a share of the current phase (true) or of the whole budget.</summary>
    public bool RestartsByPhase { get; init; } = true;

    /// <summary>
    /// Share of the budget the ejection pool may spend removing routes from the constructed plan when vehicles cost
    /// (a quarter of it at the close of the fleet phase instead, when the constructed plan broke a hard rule).
    /// </summary>
    public double SqueezeShare { get; init; } = 0.4;

    /// <summary>Share of the budget the ejection pool may spend on one route in vain before it gives up.</summary>
    public double SqueezePatience { get; init; } = 0.05;

    /// <summary>Largest share of the budget spent eliminating routes when vehicles cost.</summary>
    public double FleetShare { get; init; } = 0.6;

    /// <summary>Share of the budget without a plan on fewer routes after which route elimination stops early.</summary>
    public double FleetPatience { get; init; } = 0.3;

    /// <summary>Hard-rule prices are multiplied or divided by 1 + this at each update (<see cref="PenaltyAdapter"/>).</summary>
    public double PriceStep { get; init; } = 0.2;

    /// <summary>
    /// Share of the held-fleet phase after which the search goes back to the best plan for a cold polish; null for
    /// a search without one.
    /// </summary>
    public double? PolishFrom { get; init; }
}
