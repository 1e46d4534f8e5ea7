namespace Anneal.Formats.Input;

/// <summary>Input could not be turned into an instance; carries every problem found, not only the first.</summary>
public sealed class InputException : Exception
{
    public IReadOnlyList<InputProblem> Problems { get; }

    public InputException(IReadOnlyList<InputProblem> problems)
        : base(problems.Count == 0 ? "invalid input" : problems[0].ToString())
    {
        Problems = problems;
    }

    public InputException(InputProblem problem)
        : this([problem])
    {
    }

    public InputException()
        : this(Array.Empty<InputProblem>())
    {
    }

    public InputException(string message)
        : this(new InputProblem("input", null, null, null, message, "check the input"))
    {
    }

    public InputException(string message, Exception inner)
        : base(message, inner)
    {
        Problems = [new InputProblem("input", null, null, null, message, "check the input")];
    }
}
