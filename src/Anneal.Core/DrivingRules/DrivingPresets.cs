namespace Anneal.Core.DrivingRules;

/// <summary>
/// The rule sets that ship with Anneal, under the names checks outside the tests use. Each value names its source.
/// None of them was checked against the regulation's text while this was written (no copy was at hand): all come
/// from memory and agree with the summary in the issue that asked for them. A route is one day's shift, so weekly
/// limits, daily and weekly rest and the sleeper-berth split are outside the model.
/// </summary>
public static class DrivingPresets
{
    public const string EuName = "eu-561";
    public const string UsName = "us-hos-property";

    /// <summary>Drivers of goods vehicles in the EU, Regulation (EC) No 561/2006.</summary>
    public static DrivingRuleSet Eu { get; } = new()
    {
        Name = EuName,
        Source = "Regulation (EC) No 561/2006 Art. 6, 7 and 8",

        // Art. 7 (from memory): after a driving period of 4 h 30 a driver takes an uninterrupted break of at least 45 min.
        DrivingBeforeBreak = 270,
        BreakMinutes = 45,

        // Art. 7, second paragraph (from memory): the break may be replaced by one of at least 15 min followed by one of at least 30 min.
        SplitFirst = 15,
        SplitSecond = 30,

        // Art. 6(1) (from memory): daily driving at most 9 h; twice a week 10 h, which a one-day plan does not use.
        DailyDriving = 540,

        // Art. 8(2) (from memory): a new daily rest within 24 h of the end of the last one; a regular daily rest is 11 h
        // (Art. 4(g)), which leaves a 13 h duty span. The reduced 9 h rest (15 h span) is not used.
        DutySpan = 780,

        // Common practice, not the regulation's words: a wait for a window counts as a break when the driver is free to
        // rest and records it as a break.
        WaitingCounts = true,
    };

    /// <summary>Property-carrying drivers in the US, 49 CFR 395.3 (hours of service).</summary>
    public static DrivingRuleSet Us { get; } = new()
    {
        Name = UsName,
        Source = "49 CFR 395.3",

        // 395.3(a)(3)(ii) (from memory): driving is not allowed once 8 h of driving have passed without an interruption of at least 30 min.
        DrivingBeforeBreak = 480,
        BreakMinutes = 30,

        // 395.3(a)(3)(i) (from memory): at most 11 h of driving after 10 consecutive hours off duty.
        DailyDriving = 660,

        // 395.3(a)(2) (from memory): no driving after the 14th hour after coming on duty.
        DutySpan = 840,

        // 395.3(a)(3)(ii) as amended in 2020 (from memory): off-duty or on-duty not-driving time of 30 min ends the
        // stretch, so waiting counts. Service at a stop would count too; it is not modelled, which plans more breaks than needed.
        WaitingCounts = true,
    };

    /// <summary>Every preset by name.</summary>
    public static IReadOnlyList<DrivingRuleSet> All { get; } = [Eu, Us];

    public static DrivingRuleSet? Find(string name)
    {
        foreach (var set in All)
        {
            if (string.Equals(set.Name, name, StringComparison.OrdinalIgnoreCase))
            {
                return set;
            }
        }

        return null;
    }
}
