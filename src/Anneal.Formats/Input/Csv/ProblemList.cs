namespace Anneal.Formats.Input.Csv;

/// <summary>Collects every problem found while reading a job, so the user sees them all at once.</summary>
internal sealed class ProblemList
{
    private readonly List<InputProblem> _problems = [];

    public int Count => _problems.Count;

    public IReadOnlyList<InputProblem> All => _problems;

    /// <summary>Accepted but worth a word in `check` (see <see cref="LoadedInput.Warnings"/>).</summary>
    public List<string> Warnings { get; } = [];

    public void Add(string file, int? row, string? column, string? value, string problem, string fix) =>
        _problems.Add(new InputProblem(file, row, column, value, problem, fix));

    public void Add(InputProblem problem) => _problems.Add(problem);

    /// <summary>A problem in <paramref name="table"/>; in a workbook it also names the sheet and, for one cell, the cell.</summary>
    public void Add(CsvTable table, int? row, string? column, string? value, string problem, string fix) =>
        _problems.Add(new InputProblem(table.File, row, column, value, problem, fix) { Sheet = table.Sheet, Cell = table.CellName(row, column) });

    /// <summary>Reports at most <paramref name="shown"/> items one by one, then one line counting the rest.</summary>
    public void AddCapped<T>(IReadOnlyList<T> items, int shown, Action<T> add, Action<int> addRest)
    {
        for (int i = 0; i < items.Count && i < shown; i++)
        {
            add(items[i]);
        }

        if (items.Count > shown)
        {
            addRest(items.Count - shown);
        }
    }

    public void ThrowIfAny()
    {
        if (_problems.Count > 0)
        {
            throw new InputException(_problems.ToArray());
        }
    }
}
