using Anneal.Search.Strategy;

namespace Anneal.Search.Annealing;

/// <summary>Tuning of simulated annealing; the defaults were chosen by measurement on the Solomon instances.</summary>
public sealed record AnnealingSettings
{
    /// <summary>What the driver is tuned by; the cold polish starts at 0.9 of a held-fleet phase (see <see cref="PolishFrom"/>).</summary>
    public SearchSettings Search { get; init; } = new()
    {
        Neighbours = 30,
        StagnationFraction = 0.12,
        RestartsUntil = 0.85,
        RestartsByPhase = true,
        FleetPatience = 0.3,
        PriceStep = 0.2,
        PolishFrom = 0.9,
    };

    /// <summary>Probability of accepting the median worsening move at the start.</summary>
    public double StartAcceptance { get; init; } = 0.2;

    /// <summary>End temperature as a fraction of the start temperature.</summary>
    public double EndRatio { get; init; } = 0.002;

    /// <summary>
    /// Start temperature of the distance phase that follows route elimination, as a fraction of the run's first
    /// temperature: recalibrating from move deltas reheats so far that the rest of the budget cannot win the plan back
    /// (measured on the 1,000-stop Gehring-Homberger files).
    /// </summary>
    public double DistanceStartRatio { get; init; } = 0.1;

    /// <summary>Temperature multiplier added at a reheat; decays geometrically.</summary>
    public double ReheatBoost { get; init; } = 4;

    /// <summary>Plain moves between two string-ruin attempts (<see cref="StringRuin"/>) while the fleet is held; 0 turns them off.</summary>
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
    public double PolishFrom => Search.PolishFrom ?? 1;
}
