namespace Anneal.Formats.Input.Csv;

/// <summary>Every key settings.json (and a workbook's settings sheet) accepts; the README's table and the sample list the same.</summary>
public static class SettingsKeys
{
    public static readonly string[] Top = ["objective", "timeSeconds", "solvers", "seed", "travel", "rules", "stability", "drivingRules", "replan"];

    public static readonly string[] Travel = ["speedKmh", "detourFactor"];

    /// <summary>The prices of changing a given plan in a re-plan (`solve --from`).</summary>
    public static readonly string[] Stability = ["pricePerMove", "pricePerMinute", "toleranceMinutes"];

    public static readonly string[] Replan = ["from", "now", "without"];

    /// <summary>Each rule with the name of its price.</summary>
    public static readonly (string Name, string PriceKey)[] Rules =
        [("timeWindows", "pricePerMinute"), ("capacity", "pricePerUnit"), ("shiftEnd", "pricePerMinute"), ("maxDuration", "pricePerMinute"), ("unserved", "pricePerStop")];

    /// <summary>drivingRules' own keys: the default set's name and the sets defined here.</summary>
    public static readonly string[] Driving = ["default", "sets"];

    /// <summary>The keys of one driving-rule set under drivingRules.sets.NAME.</summary>
    public static readonly string[] DrivingSet =
        ["basedOn", "drivingBeforeBreakMinutes", "breakMinutes", "splitFirstMinutes", "splitSecondMinutes", "dailyDrivingMinutes", "dutySpanMinutes", "waitingCounts", "hard", "pricePerMinute"];

    /// <summary>How <see cref="Paths"/> writes a set's name, which the user chooses.</summary>
    public const string SetName = "<name>";

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
            else if (key == "drivingRules")
            {
                paths.Add("drivingRules.default");
                paths.AddRange(DrivingSet.Select(t => $"drivingRules.sets.{SetName}.{t}"));
            }
            else if (key == "stability")
            {
                paths.AddRange(Stability.Select(t => "stability." + t));
            }
            else if (key == "replan")
            {
                paths.AddRange(Replan.Select(t => "replan." + t));
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
