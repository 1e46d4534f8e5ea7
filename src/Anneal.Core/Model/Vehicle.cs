namespace Anneal.Core.Model;

/// <summary>One truck with its driver's shift. Vehicle types with a count are expanded to one record each.</summary>
public sealed record Vehicle
{
    public required string Id { get; init; }

    /// <summary>Index into <see cref="Instance.Depots"/>.</summary>
    public int StartDepot { get; init; }

    public int EndDepot { get; init; }

    /// <summary>One value per demand dimension of the instance.</summary>
    public required double[] Capacity { get; init; }

    public double ShiftStart { get; init; }
    public double ShiftEnd { get; init; } = double.PositiveInfinity;

    /// <summary>Longest allowed route duration (start to return); infinity when unlimited.</summary>
    public double MaxDuration { get; init; } = double.PositiveInfinity;

    public double FixedCost { get; init; }
    public double CostPerDistance { get; init; }
    public double CostPerHour { get; init; }
    /// <summary>Bit i set means the vehicle carries item i of <see cref="Instance.EquipmentNames"/> (a cold box, a tail lift).</summary>
    public ulong Equipment { get; init; }

    /// <summary>The drivers'-hours rules the route is planned under (breaks, driving and duty span); null when none.</summary>
    public DrivingRules.DrivingRuleSet? DrivingRules { get; init; }
}
