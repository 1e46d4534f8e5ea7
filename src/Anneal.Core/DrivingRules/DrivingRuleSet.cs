using Anneal.Core.Model;

namespace Anneal.Core.DrivingRules;

/// <summary>
/// One set of drivers'-hours rules a vehicle's route is planned under. All values are minutes of driving or of clock
/// time; a route is one driver's day. Breaks are placed by the evaluator (<see cref="BreakScheduler"/>), never by the user.
/// </summary>
public sealed record DrivingRuleSet
{
    /// <summary>The name vehicles.csv's <c>driving_rules</c> column and settings.json use, e.g. <c>eu-561</c>.</summary>
    public required string Name { get; init; }

    /// <summary>Where the values come from, in words (shown in reports beside the name); empty for a user's own set.</summary>
    public string Source { get; init; } = string.Empty;

    /// <summary>The longest driving before a break of full length (minutes).</summary>
    public required double DrivingBeforeBreak { get; init; }

    /// <summary>The length of a full break (minutes).</summary>
    public required double BreakMinutes { get; init; }

    /// <summary>The shorter first part of a split break (minutes); 0 when the break may not be split.</summary>
    public double SplitFirst { get; init; }

    /// <summary>The part that completes a split break after <see cref="SplitFirst"/> (minutes); 0 when the break may not be split.</summary>
    public double SplitSecond { get; init; }

    /// <summary>The most driving in the day, i.e. on one route (minutes).</summary>
    public required double DailyDriving { get; init; }

    /// <summary>The longest duty span, from leaving the depot to the return, breaks included (minutes).</summary>
    public required double DutySpan { get; init; }

    /// <summary>Waiting at a stop for its window counts as a break (or as a part of one) when it is long enough.</summary>
    public bool WaitingCounts { get; init; }

    /// <summary>Hard by default; soft with a price per minute over the daily driving or the duty span.</summary>
    public Rule Rule { get; init; } = Rule.HardRule;

    /// <summary>True when the break may be taken as <see cref="SplitFirst"/> then <see cref="SplitSecond"/>.</summary>
    public bool MaySplit => SplitFirst > 0 && SplitSecond > 0;

    /// <summary>The name and, for a preset, its source: "eu-561 (Regulation (EC) No 561/2006 Art. 6 and 7)".</summary>
    public string Title => Source.Length > 0 ? $"{Name} ({Source})" : Name;
}
