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

    /// <summary>Fraction of the budget without a new best after which the search returns to the best and reheats.</summary>
    public double StagnationFraction { get; init; } = 0.12;

    /// <summary>Temperature multiplier added at a reheat; decays geometrically.</summary>
    public double ReheatBoost { get; init; } = 4;
}
