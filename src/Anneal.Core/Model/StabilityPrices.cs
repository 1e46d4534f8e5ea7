namespace Anneal.Core.Model;

/// <summary>
/// The soft rule of a re-plan: keep the plan the drivers already have. A stop served by another vehicle than the
/// given plan's costs <see cref="PerMove"/>; a stop whose start of service moves by more than
/// <see cref="ToleranceMinutes"/> from the given plan's costs <see cref="PerMinute"/> per time unit beyond it. Both
/// count only for stops that carry a planned vehicle or start (<see cref="Stop.PlannedVehicle"/>,
/// <see cref="Stop.PlannedStart"/>), that is in a re-plan; a price of 0 turns its part off.
/// </summary>
public sealed record StabilityPrices(double PerMove, double PerMinute, double ToleranceMinutes)
{
    /// <summary>Modest prices: a move costs about 14 km of a box van, a late or early start 0.2 per minute beyond 15.</summary>
    public static StabilityPrices Default { get; } = new(5, 0.2, 15);

    public static StabilityPrices Off { get; } = new(0, 0, 0);
}
