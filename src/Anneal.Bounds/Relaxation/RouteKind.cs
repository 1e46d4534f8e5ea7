namespace Anneal.Bounds.Relaxation;

/// <summary>
/// Vehicles that are alike for the relaxation (depots, capacity, shift, equipment, prices): any of their routes
/// costs the same and is feasible for each of them, so the bound counts their routes together, at most
/// <see cref="Count"/> of them.
/// </summary>
public sealed class RouteKind
{
    /// <summary>Vehicles of this kind; each drives at most one route, so this bounds the kind's routes.</summary>
    public required int Count { get; init; }

    /// <summary>Index of one vehicle of the kind in the instance's fleet.</summary>
    public required int Representative { get; init; }

    /// <summary>The price of using a vehicle (fixed cost, or the vehicle weight under vehicles-then-distance).</summary>
    public required double FixedCost { get; init; }

    public required double PerDistance { get; init; }

    /// <summary>Objective per time unit of driving and service (waiting is not counted: see <see cref="RelaxedInstance"/>).</summary>
    public required double PerTime { get; init; }

    /// <summary>Start and end locations (instance location indices).</summary>
    public required int Start { get; init; }

    public required int End { get; init; }

    /// <summary>Capacity per dimension, widened by the evaluator's tolerance; infinity where capacity is soft.</summary>
    public required double[] Capacity { get; init; }

    public required double ShiftStart { get; init; }

    /// <summary>Latest return, widened by the tolerance; infinity when the shift end is soft or open.</summary>
    public required double LatestReturn { get; init; }

    /// <summary>True for each stop the kind may serve (equipment, and a route of its own keeps the hard rules).</summary>
    public required bool[] Serves { get; init; }

    /// <summary>True when a route's schedule can break a hard rule (hard windows, or a hard finite shift end).</summary>
    public required bool TimeMatters { get; init; }
}
