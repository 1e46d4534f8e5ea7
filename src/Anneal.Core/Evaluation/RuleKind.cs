namespace Anneal.Core.Evaluation;

/// <summary>Which rule a <see cref="Violation"/> breaks; the texts are summary.json's <c>rule</c> values.</summary>
public enum RuleKind
{
    TimeWindow,
    Capacity,
    ShiftEnd,
    MaxDuration,
    Equipment,
    Unserved,

    /// <summary>A collect-and-deliver pair not served by one vehicle, collection first.</summary>
    Pair,
}

public static class RuleKindNames
{
    public static string ToText(this RuleKind rule) => rule switch
    {
        RuleKind.TimeWindow => "time-window",
        RuleKind.Capacity => "capacity",
        RuleKind.ShiftEnd => "shift-end",
        RuleKind.MaxDuration => "max-duration",
        RuleKind.Equipment => "equipment",
        RuleKind.Unserved => "unserved",
        RuleKind.Pair => "pair",
        _ => throw new ArgumentOutOfRangeException(nameof(rule)),
    };
}
