namespace Anneal.Formats.Input;

/// <summary>One thing wrong with an input file, located precisely enough to fix it.</summary>
/// <param name="File">File name as the user gave it (or relative to the job folder).</param>
/// <param name="Row">1-based line number in the file (the header is line 1); null when it concerns the whole file.</param>
/// <param name="Column">Column name or field; null when the whole row or file is concerned.</param>
/// <param name="Value">The offending text as found, or null.</param>
/// <param name="Problem">What is wrong, in plain words.</param>
/// <param name="Fix">How to put it right.</param>
public sealed record InputProblem(string File, int? Row, string? Column, string? Value, string Problem, string Fix)
{
    // User text is capped once here, so no message, error.txt or JSON output quotes more than a short piece of it.
    public string? Column { get; init; } = Quote.CapOrNull(Column);

    public string? Value { get; init; } = Quote.CapOrNull(Value);

    public string Problem { get; init; } = Quote.Cap(Problem, Quote.TextCharacters);

    public string Fix { get; init; } = Quote.Cap(Fix, Quote.TextCharacters);

    /// <summary>The workbook sheet the problem is on; null for other files.</summary>
    public string? Sheet { get; init; }

    /// <summary>The workbook cell (e.g. "D4") the problem is in, when it is about one cell.</summary>
    public string? Cell { get; init; }

    /// <summary>For a JSON file: the key's path (e.g. "rules.timeWindows.hard"); <see cref="Row"/> is then its line.</summary>
    public string? JsonPath { get; init; }

    /// <summary>For a JSON file: the character column within the line, from 1.</summary>
    public int? Position { get; init; }

    private bool InJson => JsonPath is not null || Position is not null;

    public override string ToString()
    {
        var where = File;
        if (Sheet is not null)
        {
            where += $", sheet '{Sheet}'";
        }

        if (Row is not null)
        {
            where += InJson ? $", line {Row}" : $", row {Row}";
        }

        if (Position is not null)
        {
            where += $", column {Position}";
        }

        if (JsonPath is not null)
        {
            where += $", at {JsonPath}";
        }

        if (Column is not null)
        {
            where += $", column '{Column}'";
        }

        if (Cell is not null)
        {
            where += $" (cell {Cell})";
        }

        var value = Value is null ? string.Empty : $" (value '{Value}')";
        return $"{where}: {Problem}{value}. Fix: {Fix}";
    }
}
