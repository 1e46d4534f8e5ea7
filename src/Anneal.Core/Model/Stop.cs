namespace Anneal.Core.Model;

/// <summary>
/// A place to deliver to and collect from. Demand is loaded at the vehicle's start depot, unless the stop is the
/// delivery end of a pair (<see cref="CollectFrom"/>): then it is what the vehicle collected at the partner stop.
/// What a stop collects (<see cref="Pickup"/>) rides on to the depot, or to its pair's delivery stop.
/// </summary>
public sealed record Stop
{
    public required string Id { get; init; }

    /// <summary>What the driver reads (a shop's name); empty when the input gives none.</summary>
    public string Name { get; init; } = string.Empty;

    /// <summary>Where the driver goes, as written in the input; empty when it gives none.</summary>
    public string Address { get; init; } = string.Empty;
    public required double X { get; init; }
    public required double Y { get; init; }

    /// <summary>One value per demand dimension of the instance.</summary>
    public required double[] Demand { get; init; }

    /// <summary>What is collected here, one value per dimension; empty means nothing (a delivery-only stop).</summary>
    public double[] Pickup { get; init; } = [];

    /// <summary>
    /// Index of the stop (in <see cref="Instance.Stops"/>) where this stop's delivery is collected, or -1 when it comes
    /// from the depot. Both stops of a pair are served by one vehicle, the collection first.
    /// </summary>
    public int CollectFrom { get; init; } = -1;

    public double ServiceTime { get; init; }

    /// <summary>Sorted, non-overlapping windows; at least one.</summary>
    public required TimeWindow[] Windows { get; init; }

    /// <summary>Bit i set means the stop needs item i of <see cref="Instance.EquipmentNames"/>.</summary>
    public ulong Needs { get; init; }

    /// <summary>An optional stop may be left unserved at <see cref="UnservedPenalty"/>.</summary>
    public bool Optional { get; init; }

    /// <summary>Price of leaving the stop unserved; NaN means the rule set's default price.</summary>
    public double UnservedPenalty { get; init; } = double.NaN;

    /// <summary>The vehicle (index into <see cref="Instance.Vehicles"/>) the given plan of a re-plan had it on; -1 when none.</summary>
    public int PlannedVehicle { get; init; } = -1;

    /// <summary>The start of service the given plan of a re-plan had; NaN when none.</summary>
    public double PlannedStart { get; init; } = double.NaN;
}
