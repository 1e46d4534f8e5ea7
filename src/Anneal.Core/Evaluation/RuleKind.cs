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

    /// <summary>More driving in the day than the vehicle's driving rules allow.</summary>
    DrivingTime,

    /// <summary>A duty span (depot to depot, breaks included) longer than the vehicle's driving rules allow.</summary>
    DutySpan,
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
        RuleKind.DrivingTime => "driving-time",
        RuleKind.DutySpan => "duty-span",
        _ => throw new ArgumentOutOfRangeException(nameof(rule)),
    };
}
