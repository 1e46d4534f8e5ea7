namespace Anneal.Formats.Input.Csv;

/// <summary>Skill names and their bits: vehicles' skills first, in order of appearance (bit i = name i).</summary>
internal sealed class SkillIndex
{
    /// <summary>Skills are a 64-bit mask on stops and vehicles.</summary>
    public const int Max = 64;

    private readonly Dictionary<string, int> _bits = new(StringComparer.OrdinalIgnoreCase);
    private readonly List<string> _names = [];

    public IReadOnlyList<string> Names => _names;

    public bool Contains(string name) => _bits.ContainsKey(name);

    /// <summary>The skill's bit, adding the name when new; 0 (with a problem) past 64 skills.</summary>
    public ulong Bit(string name, Cells cells, string column)
    {
        if (!_bits.TryGetValue(name, out int bit))
        {
            if (_names.Count >= Max)
            {
                cells.Report(column, name, $"more than {Max} different skills in the job", $"use at most {Max} skill names");
                return 0;
            }

            bit = _names.Count;
            _bits[name] = bit;
            _names.Add(name);
        }

        return 1UL << bit;
    }
}
