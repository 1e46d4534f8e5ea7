namespace Anneal.Formats.Input.Csv;

/// <summary>Equipment names and their bits: what vehicles carry first, in order of appearance (bit i = name i).</summary>
internal sealed class EquipmentIndex
{
    /// <summary>Equipment is a 64-bit mask on stops and vehicles.</summary>
    public const int Max = 64;

    private readonly Dictionary<string, int> _bits = new(StringComparer.OrdinalIgnoreCase);
    private readonly List<string> _names = [];

    public IReadOnlyList<string> Names => _names;

    public bool Contains(string name) => _bits.ContainsKey(name);

    /// <summary>The item's bit, adding the name when new; 0 (with a problem) past 64 items.</summary>
    public ulong Bit(string name, Cells cells, string column)
    {
        if (!_bits.TryGetValue(name, out int bit))
        {
            if (_names.Count >= Max)
            {
                cells.Report(column, name, $"more than {Max} different kinds of equipment in the job", $"use at most {Max} equipment names");
                return 0;
            }

            bit = _names.Count;
            _bits[name] = bit;
            _names.Add(name);
        }

        return 1UL << bit;
    }
}
