using Anneal.Core.Evaluation;

namespace Anneal.Search.Representation;

/// <summary>An amount per hard rule: how much a plan breaks each, or how much a move changes that.</summary>
public struct RuleAmounts
{
    public double TimeWindow;
    public double Capacity;
    public double Overtime;
    public double Duration;
    public double Equipment;
    public double Unserved;

    /// <summary>The amounts priced by the search's weights.</summary>
    public readonly double Weighted(in PenaltyWeights w) =>
        (TimeWindow * w.TimeWindow) + (Capacity * w.Capacity) + (Overtime * w.Overtime)
        + (Duration * w.Duration) + (Equipment * w.Equipment) + (Unserved * w.Unserved);

    /// <summary>Sum over the route-level rules (all but unserved), in their own units.</summary>
    public readonly double RouteTotal => TimeWindow + Capacity + Overtime + Duration + Equipment;
}
