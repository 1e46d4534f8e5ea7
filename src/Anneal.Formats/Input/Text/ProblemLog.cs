namespace Anneal.Formats.Input.Text;

/// <summary>Collects the problems of one file so a reader can report every bad row at once.</summary>
internal sealed class ProblemLog(string file)
{
    /// <summary>Enough to fix a file in one pass without burying the first problems.</summary>
    private const int MaxProblems = 200;

    private readonly List<InputProblem> _problems = [];

    public string File { get; } = file;

    public int Count => _problems.Count;

    public void Add(int? row, string? column, string? value, string problem, string fix)
    {
        if (_problems.Count < MaxProblems)
        {
            _problems.Add(new InputProblem(File, row, column, value, problem, fix));
        }
    }

    /// <summary>Reports a value outside <paramref name="range"/> (see <see cref="Limits"/>); false when it was reported.</summary>
    public bool InRange(int? row, string column, string token, double value, NumberRange range, string meaning)
    {
        if (range.Contains(value))
        {
            return true;
        }

        Add(row, column, token, Limits.Problem(range), Limits.Fix(range, meaning));
        return false;
    }

    public void ThrowIfAny()
    {
        if (_problems.Count > 0)
        {
            throw new InputException(_problems.ToArray());
        }
    }
}
