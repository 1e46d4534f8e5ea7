namespace Anneal.Core.Model;

/// <summary>
/// Whether a rule may be broken, and the price of breaking it when it may. A hard rule may carry a price too: for
/// <see cref="RuleSet.Unserved"/> it is the price of leaving out an optional stop without a penalty of its own; the
/// other rules ignore it while hard.
/// </summary>
public readonly record struct Rule(bool Hard, double Price)
{
    public static Rule HardRule => new(true, 0);
    public static Rule Soft(double price) => new(false, price);
}

/// <summary>
/// Per-rule choice of hard or soft. Prices: time windows per time unit late, capacity per unit over
/// (summed over dimensions), shift end per time unit of overtime, maximum duration per time unit over,
/// unserved per stop (a stop's own penalty takes precedence). Equipment is always hard.
/// </summary>
public sealed record RuleSet
{
    public Rule TimeWindows { get; init; } = Rule.HardRule;
    public Rule Capacity { get; init; } = Rule.HardRule;
    public Rule ShiftEnd { get; init; } = Rule.HardRule;
    public Rule MaxDuration { get; init; } = Rule.HardRule;

    /// <summary>
    /// Hard: mandatory stops must be served; optional ones may still be dropped, at their own penalty or else at this
    /// rule's price. Soft: any stop may be dropped at its penalty, else at the price.
    /// </summary>
    public Rule Unserved { get; init; } = Rule.HardRule;

    /// <summary>Prices of changing a given plan (a re-plan's soft rule); they count only for stops with a planned vehicle or start.</summary>
    public StabilityPrices Stability { get; init; } = StabilityPrices.Default;

    public static RuleSet AllHard { get; } = new();
}
