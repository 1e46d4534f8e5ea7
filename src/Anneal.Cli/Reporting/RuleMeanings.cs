using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Cli.Reporting;

/// <summary>What each rule's settings mean once read, one line per rule, for `check`: no setting vanishes unsaid.</summary>
public static class RuleMeanings
{
    public static IReadOnlyList<string> Lines(Instance instance)
    {
        var r = instance.Rules;
        string unit = instance.Units.TimeWord;
        return
        [
            Line("time windows", r.TimeWindows, "service starts within a window (waiting allowed)", $"per {unit} late; lateness delays the rest of the route"),
            Line("capacity", r.Capacity, "the load never exceeds a capacity", "per unit over a capacity, summed over dimensions"),
            Line("shift end", r.ShiftEnd, "every vehicle is back by its shift end", $"per {unit} after the shift end"),
            Line("max duration", r.MaxDuration, "no route lasts longer than its vehicle's max_duration", $"per {unit} over max_duration"),
            Unserved(r.Unserved),
            "equipment: hard (always): a stop is served only by a vehicle carrying all it needs",
            .. Driving(instance),
        ];
    }

    /// <summary>One line per driving-rule set in use: its vehicles, limits and source; none when no vehicle has rules.</summary>
    private static List<string> Driving(Instance instance)
    {
        var lines = new List<string>();
        var seen = new List<Core.DrivingRules.DrivingRuleSet>();
        foreach (var v in instance.Vehicles)
        {
            if (v.DrivingRules is { } set && !seen.Contains(set))
            {
                seen.Add(set);
            }
        }

        foreach (var set in seen)
        {
            int count = instance.Vehicles.Count(v => Equals(v.DrivingRules, set));
            string split = set.MaySplit ? string.Create(CultureInfo.InvariantCulture, $" (or {set.SplitFirst:0.##} then {set.SplitSecond:0.##})") : string.Empty;
            string how = set.Rule.Hard ? "hard" : string.Create(CultureInfo.InvariantCulture, $"soft: {set.Rule.Price:0.##} per min over the day's driving or the duty span");
            lines.Add(string.Create(CultureInfo.InvariantCulture,
                $"driving rules {set.Title}: {how}; {count} vehicle(s); a break of {set.BreakMinutes:0.##} min{split} after {set.DrivingBeforeBreak:0.##} min of driving, at most {set.DailyDriving:0.##} min of driving and a duty span of {set.DutySpan:0.##} min a day{(set.WaitingCounts ? "; a long enough wait counts as a break" : string.Empty)}"));
        }

        return lines;
    }

    private static string Line(string name, Rule rule, string hard, string per) => rule.Hard
        ? $"{name}: hard: {hard}" + (rule.Price > 0 ? string.Create(CultureInfo.InvariantCulture, $" (its price {rule.Price:0.##} is not used while hard)") : string.Empty)
        : string.Create(CultureInfo.InvariantCulture, $"{name}: soft: {rule.Price:0.##} {per}");

    private static string Unserved(Rule rule)
    {
        string price = rule.Price > 0
            ? string.Create(CultureInfo.InvariantCulture, $"{rule.Price:0.##}")
            : "no cost";
        return rule.Hard
            ? $"unserved: hard: every mandatory stop is served; an optional stop is left out at its own penalty, or else at {price}"
            : $"unserved: soft: any stop may be left out, at its own penalty, or else at {price}";
    }
}
