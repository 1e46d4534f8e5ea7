using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Core.Screening;

/// <summary>
/// Rules and data that are valid but likely not what was meant, because a setting would otherwise vanish without a
/// word: a price on a hard rule that ignores it, optional stops that cost nothing to leave out, a capacity that no
/// demand uses, a cost objective without prices. `check` prints these as warnings.
/// </summary>
public static class RuleScreen
{
    /// <summary>How many stop ids a warning lists before it only counts the rest.</summary>
    private const int Listed = 5;

    public static IReadOnlyList<string> Warnings(Instance instance)
    {
        var warnings = new List<string>();
        if (ObjectiveWarning(instance) is { } objective)
        {
            warnings.Add(objective);
        }

        var r = instance.Rules;
        string unit = instance.Units.TimeWord;
        UnusedPrice("time windows", r.TimeWindows, "timeWindows", $"per {unit} late");
        UnusedPrice("capacity", r.Capacity, "capacity", "per unit over");
        UnusedPrice("shift end", r.ShiftEnd, "shiftEnd", $"per {unit} over");
        UnusedPrice("max duration", r.MaxDuration, "maxDuration", $"per {unit} over");

        var free = new List<string>();
        for (int s = 0; s < instance.StopCount; s++)
        {
            if (instance.MayDrop(s) && !(instance.UnservedPrice(s) > 0))
            {
                free.Add(instance.Stops[s].Id);
            }
        }

        if (free.Count > 0)
        {
            warnings.Add($"{free.Count} stop(s) may be left out at no cost ({List(free)}): the search drops such a stop whenever serving it costs anything. "
                + "Give each a penalty, or set rules.unserved.pricePerStop (the price of leaving out an optional stop without a penalty of its own).");
        }

        for (int d = 0; d < instance.DimensionCount; d++)
        {
            bool any = false;
            for (int s = 0; s < instance.StopCount && !any; s++)
            {
                any = instance.Demand(s, d) > 0;
            }

            if (!any && instance.StopCount > 0)
            {
                string name = instance.DimensionNames[d];
                warnings.Add($"no stop has a demand in {name} (is a demand_{name} column missing?), so the capacity in {name} limits nothing");
            }
        }

        return warnings;

        void UnusedPrice(string name, Rule rule, string key, string per)
        {
            if (rule.Hard && rule.Price > 0)
            {
                warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"{name} is hard, so its price {rule.Price:0.##} {per} is not used; set rules.{key}.hard to false to make it soft at that price"));
            }
        }
    }

    /// <summary>
    /// A cost objective whose vehicles have no price at all: every route then costs 0, so the objective cannot tell
    /// plans apart (only soft-rule prices and penalties still count; ties fall to distance, then duration). Null when
    /// the objective can tell them apart. `solve` prints it too.
    /// </summary>
    public static string? ObjectiveWarning(Instance instance)
    {
        if (instance.Objective != Objective.Cost || instance.Vehicles.Count == 0)
        {
            return null;
        }

        foreach (var v in instance.Vehicles)
        {
            if (v.FixedCost != 0 || v.CostPerDistance != 0 || v.CostPerHour != 0)
            {
                return null;
            }
        }

        return "the objective is cost, but no vehicle has a fixed_cost, cost_per_km or cost_per_hour, so every route costs 0 and the objective "
            + "cannot tell plans apart (only soft-rule prices and penalties count; ties go to the shorter distance, then the shorter duration). "
            + "Give the vehicles their prices in vehicles.csv, or set \"objective\": \"distance\" in settings.json (or --objective distance).";
    }

    private static string List(List<string> ids) =>
        string.Join(", ", ids.GetRange(0, Math.Min(Listed, ids.Count))) + (ids.Count > Listed ? $" and {ids.Count - Listed} more" : string.Empty);
}
