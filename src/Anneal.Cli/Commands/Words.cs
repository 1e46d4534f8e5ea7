namespace Anneal.Cli.Commands;

/// <summary>Lists of allowed values in plain words.</summary>
public static class Words
{
    /// <summary>"a, b or c".</summary>
    public static string OneOf(IReadOnlyList<string> choices) => choices.Count switch
    {
        0 => "nothing",
        1 => choices[0],
        _ => string.Join(", ", choices.Take(choices.Count - 1)) + " or " + choices[^1],
    };
}
