namespace Anneal.Core.Screening;

/// <summary>A stop that no vehicle can ever serve without breaking a hard rule, and why.</summary>
/// <param name="Rule">The rule every vehicle fails (<c>capacity</c>, <c>equipment</c>, <c>time-window</c>, <c>shift-end</c>,
/// <c>max-duration</c>), <c>several</c>, or <c>fleet</c> when there are no vehicles.</param>
/// <param name="Reason">Words that follow "stop &lt;id&gt; ", e.g. "needs 900 trays; the largest vehicle carries 400 trays".</param>
public sealed record ScreenFinding(int StopIndex, string StopId, string Rule, string Reason)
{
    /// <summary>The whole sentence: "stop C15 needs 900 trays; …".</summary>
    public string Message => $"stop {StopId} {Reason}";
}
