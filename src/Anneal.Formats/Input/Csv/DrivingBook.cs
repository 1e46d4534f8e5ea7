using Anneal.Core.DrivingRules;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// The driving-rule sets a job's vehicles may name: the presets, then the sets settings.json defines (a set of a
/// preset's name replaces it for this job), and the default for vehicles whose <c>driving_rules</c> cell is empty.
/// </summary>
internal sealed record DrivingBook(IReadOnlyDictionary<string, DrivingRuleSet> Sets, DrivingRuleSet? Default)
{
    /// <summary>The name a vehicle gives to work under no driving rules even when settings.json has a default.</summary>
    public const string None = "none";

    public static DrivingBook PresetsOnly { get; } = new(Presets(), null);

    public static Dictionary<string, DrivingRuleSet> Presets()
    {
        var sets = new Dictionary<string, DrivingRuleSet>(StringComparer.OrdinalIgnoreCase);
        foreach (var p in DrivingPresets.All)
        {
            sets[p.Name] = p;
        }

        return sets;
    }

    /// <summary>Every name a vehicle may give, for the fix of an unknown one.</summary>
    public IReadOnlyList<string> Names()
    {
        var names = new List<string>(Sets.Keys) { None };
        names.Sort(StringComparer.Ordinal);
        return names;
    }
}
