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
        _ => throw new ArgumentOutOfRangeException(nameof(rule)),
    };
}
