namespace Anneal.Formats.Input.Json;

/// <summary>A JSON text that cannot be read, with the place (line and character column, from 1) and what is wrong there in plain words.</summary>
public sealed class JsonSyntaxException : Exception
{
    public int Line { get; }

    public int Column { get; }

    public JsonSyntaxException(int line, int column, string message)
        : base(message)
    {
        Line = line;
        Column = column;
    }

    public JsonSyntaxException()
    {
    }

    public JsonSyntaxException(string message)
        : base(message)
    {
    }

    public JsonSyntaxException(string message, Exception inner)
        : base(message, inner)
    {
    }

    /// <summary>The problem to report for <paramref name="file"/>.</summary>
    public InputProblem Problem(string file, string fix) =>
        new(file, Line, null, null, "not valid JSON: " + Message, fix) { Position = Column };
}
