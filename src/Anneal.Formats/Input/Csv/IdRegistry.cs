namespace Anneal.Formats.Input.Csv;

/// <summary>Unique ids of one file with the line each was defined on, so a duplicate can point at the first.</summary>
internal sealed class IdRegistry
{
    /// <summary>Longest id accepted: ids appear in every route sheet and message.</summary>
    public const int MaxLength = 100;

    private readonly Dictionary<string, (int Index, int Line)> _ids = new(StringComparer.Ordinal);

    public int Count => _ids.Count;

    /// <summary>Registers <paramref name="id"/> as record <paramref name="index"/>; reports a duplicate and returns false.</summary>
    public bool Add(string id, int index, Cells cells, string what)
    {
        if (id.Length > MaxLength)
        {
            cells.Report("id", id, $"the id has {id.Length:N0} characters", $"give the {what} an id of at most {MaxLength} characters (a note… column may hold a longer description)");
            return false;
        }

        if (_ids.TryGetValue(id, out var first))
        {
            cells.Report("id", id, $"duplicate {what} id (first used on row {first.Line})", "give every " + what + " its own id");
            return false;
        }

        _ids[id] = (index, cells.Line);
        return true;
    }

    public bool TryGet(string id, out int index)
    {
        bool found = _ids.TryGetValue(id, out var entry);
        index = entry.Index;
        return found;
    }

    public IEnumerable<string> Ids => _ids.Keys;
}
