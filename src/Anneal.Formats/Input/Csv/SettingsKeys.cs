namespace Anneal.Formats.Input.Csv;

/// <summary>Every key settings.json (and a workbook's settings sheet) accepts; the README's table and the sample list the same.</summary>
public static class SettingsKeys
{
    public static readonly string[] Top = ["objective", "timeSeconds", "solvers", "seed", "travel", "rules", "stability"];

    public static readonly string[] Travel = ["speedKmh", "detourFactor"];

    /// <summary>The prices of changing a given plan in a re-plan (`solve --from`).</summary>
    public static readonly string[] Stability = ["pricePerMove", "pricePerMinute", "toleranceMinutes"];

    /// <summary>Each rule with the name of its price.</summary>
    public static readonly (string Name, string PriceKey)[] Rules =
        [("timeWindows", "pricePerMinute"), ("capacity", "pricePerUnit"), ("shiftEnd", "pricePerMinute"), ("maxDuration", "pricePerMinute"), ("unserved", "pricePerStop")];

    /// <summary>Every leaf key as a dotted path, e.g. "rules.timeWindows.pricePerMinute".</summary>
    public static IReadOnlyList<string> Paths()
    {
        var paths = new List<string>();
        foreach (var key in Top)
        {
            if (key == "travel")
            {
                paths.AddRange(Travel.Select(t => "travel." + t));
            }
            else if (key == "stability")
            {
                paths.AddRange(Stability.Select(t => "stability." + t));
            }
            else if (key == "rules")
            {
                foreach (var (name, price) in Rules)
                {
                    paths.Add($"rules.{name}.hard");
                    paths.Add($"rules.{name}.{price}");
                }
            }
            else
            {
                paths.Add(key);
            }
        }

        return paths;
    }
}
