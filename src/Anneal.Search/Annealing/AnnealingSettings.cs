namespace Anneal.Search.Annealing;

/// <summary>Tuning of simulated annealing; the defaults were chosen by measurement on the Solomon instances.</summary>
public sealed record AnnealingSettings
{
    /// <summary>Granular neighbourhood size k.</summary>
    public int Neighbours { get; init; } = 30;

    /// <summary>Probability of accepting the median worsening move at the start.</summary>
    public double StartAcceptance { get; init; } = 0.2;

    /// <summary>End temperature as a fraction of the start temperature.</summary>
    public double EndRatio { get; init; } = 0.002;

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

    /// <summary>
    /// Start temperature of the distance phase that follows route elimination, as a fraction of the run's first
    /// temperature: recalibrating from move deltas reheats so far that the rest of the budget cannot win the plan back
    /// (measured on the 1,000-stop Gehring-Homberger files).
    /// </summary>
    public double DistanceStartRatio { get; init; } = 0.1;

    /// <summary>Fraction of the budget without a new best after which the search returns to the best and reheats.</summary>
    public double StagnationFraction { get; init; } = 0.12;

    /// <summary>Temperature multiplier added at a reheat; decays geometrically.</summary>
    public double ReheatBoost { get; init; } = 4;

    /// <summary>Plain moves between two string-ruin attempts (<see cref="Strategy.StringRuin"/>) while the fleet is held; 0 turns them off.</summary>
    public int RuinEvery { get; init; } = 100;

    /// <summary>
    /// End temperature of the distance phase on a held fleet, as a fraction of its start: the string ruins keep
    /// finding shorter plans at temperatures where the plain moves alone are frozen (measured on rc1_10_1).
    /// </summary>
    public double HeldEndRatio { get; init; } = 0.1;

    /// <summary>
    /// Share of the held-fleet phase after which the search goes back to the best plan and cools from
    /// <see cref="HeldEndRatio"/> to <see cref="EndRatio"/>: a warm end left the demo's plan 14% dearer, and a longer
    /// polish (from 0.8) cost rc1_10_1 0.8 points.
    /// </summary>
    public double PolishFrom { get; init; } = 0.9;
}
