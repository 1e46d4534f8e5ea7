namespace Anneal.Core.Screening;

/// <summary>Something the job asks that no plan can give, found before any search, in words a coordinator reads.</summary>
/// <param name="Rule">The rule in the way, as violations name it (<c>capacity</c>, <c>equipment</c>, <c>time-window</c>,
/// <c>shift-end</c>, <c>max-duration</c>), <c>several</c>, or <c>fleet</c> when there are no vehicles.</param>
/// <param name="Stop">The stop concerned, or null when the whole day is too much for the fleet.</param>
/// <param name="Message">What cannot be done and why, e.g. "the day's 804 kg exceed the fleet's 320 kg".</param>
public sealed record Obstacle(string Rule, string? Stop, string Message);
