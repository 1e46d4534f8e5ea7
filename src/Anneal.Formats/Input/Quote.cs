namespace Anneal.Formats.Input;

/// <summary>Keeps user text in messages short: a 100,000-character cell must not become a 100 KB error line.</summary>
public static class Quote
{
    /// <summary>Most characters of a value a message shows.</summary>
    public const int ValueCharacters = 80;

    /// <summary>Most characters of a whole problem or fix text (they may name ids or list accepted keys).</summary>
    public const int TextCharacters = 600;

    /// <summary>The text itself when short, else its start, an ellipsis and its length.</summary>
    public static string Cap(string text, int max = ValueCharacters) =>
        text.Length <= max ? text : string.Concat(text.AsSpan(0, max), $"… ({text.Length:N0} characters)");

    public static string? CapOrNull(string? text, int max = ValueCharacters) => text is null ? null : Cap(text, max);
}
