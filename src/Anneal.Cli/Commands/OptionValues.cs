using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using Anneal.Formats.Input;

namespace Anneal.Cli.Commands;

/// <summary>
/// Typed options whose wrong values are refused at parse time in the user's words ("--time expects a number of
/// seconds above 0, e.g. 30, not 'abc'"), never with the parser's .NET type names; every wrong option is reported
/// together with the others.
/// </summary>
public static class OptionValues
{
    /// <summary>Seconds above 0 (or from 0 when <paramref name="zero"/>), e.g. a time budget.</summary>
    public static Option<double?> Seconds(string name, string description, bool zero = false) =>
        Parsed<double?>(name, description, "seconds", null, (string text, out double? v) => Ok(TrySeconds(text, zero, out double s), s, out v),
            zero ? "a number of seconds, 0 or more, e.g. 2" : "a number of seconds above 0, e.g. 30");

    /// <summary>Seconds with a default when the option is absent.</summary>
    public static Option<double> Seconds(string name, string description, double fallback, bool zero) =>
        Parsed<double>(name, description, "seconds", fallback, (string text, out double v) => TrySeconds(text, zero, out v),
            zero ? "a number of seconds, 0 or more, e.g. 2" : "a number of seconds above 0, e.g. 30");

    /// <summary>One or more budgets, comma-separated, each above 0 seconds ("5,30").</summary>
    public static Option<string> SecondsList(string name, string description, string fallback) =>
        Parsed<string>(name, description, "s[,s…]", fallback, (string text, out string v) => Ok(BenchBudgets(text) is { Count: > 0 }, text, out v),
            "one or more numbers of seconds above 0, comma-separated, e.g. 5,30");

    /// <summary>A whole number of at least <paramref name="least"/>.</summary>
    public static Option<int?> Whole(string name, string description, int least, string helpName = "n") =>
        Parsed<int?>(name, description, helpName, null, (string text, out int? v) => Ok(TryWhole(text, least, int.MaxValue, out long w), (int)w, out v), Expects(least));

    /// <summary>A whole number of at least <paramref name="least"/>, with a default when the option is absent.</summary>
    public static Option<int> Whole(string name, string description, int least, int fallback) =>
        Parsed<int>(name, description, "n", fallback, (string text, out int v) => Ok(TryWhole(text, least, int.MaxValue, out long w), (int)w, out v), Expects(least));

    /// <summary>A whole number of at least <paramref name="least"/>, up to 64 bits (iteration counts).</summary>
    public static Option<long?> Count(string name, string description, long least) =>
        Parsed<long?>(name, description, "n", null, (string text, out long? v) => Ok(TryWhole(text, least, long.MaxValue, out long w), w, out v), Expects(least));

    /// <summary>Any whole number that fits 32 bits (a seed).</summary>
    public static Option<int?> Seed(string name, string description) =>
        Parsed<int?>(name, description, "n", null, (string text, out int? v) => Ok(TryWhole(text, int.MinValue, int.MaxValue, out long w), (int)w, out v), "a whole number, e.g. 7");

    /// <summary>A clock time of the job's day, HH:MM up to 47:59 (or minutes), e.g. `--now 11:20`.</summary>
    public static Option<double?> Clock(string name, string description) =>
        Parsed<double?>(name, description, "HH:MM", null, (string text, out double? v) => Ok(Anneal.Formats.Input.Csv.TimeText.TryParseTime(text, out double t), t, out v),
            "a clock time HH:MM (up to 47:59), e.g. 11:20");

    /// <summary>Any finite number (an objective value).</summary>
    public static Option<double?> Number(string name, string description, string helpName) =>
        Parsed<double?>(name, description, helpName, null,
            (string text, out double? v) => Ok(double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double d) && double.IsFinite(d), d, out v),
            "a number with a dot for decimals, e.g. 1250.5");

    /// <summary>One of <paramref name="choices"/>; a near miss is named ("did you mean distance?").</summary>
    public static Option<string?> Choice(string name, string description, string helpName, params string[] choices)
    {
        var option = new Option<string?>(name) { Description = description, HelpName = helpName };
        option.CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return null;
            }

            string text = result.Tokens[0].Value;
            foreach (var c in choices)
            {
                if (string.Equals(c, text, StringComparison.OrdinalIgnoreCase))
                {
                    return c;
                }
            }

            var near = Closest.Find(text, choices);
            result.AddError($"{name} expects {Words.OneOf(choices)}, not '{text}'" + (near is null ? string.Empty : $"; did you mean {near}?"));
            return null;
        };
        return option;
    }

    /// <summary>"5,30" → [5, 30]; null when a part is not a number of seconds above 0.</summary>
    public static IReadOnlyList<double>? BenchBudgets(string text)
    {
        var budgets = new List<double>();
        foreach (var part in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            if (!TrySeconds(part, false, out double b))
            {
                return null;
            }

            budgets.Add(b);
        }

        return budgets;
    }

    private static string Expects(long least) => least switch
    {
        0 => "a whole number, 0 or more, e.g. 3",
        1 => "a whole number, 1 or more, e.g. 3",
        _ => $"a whole number of at least {least}",
    };

    private static bool TrySeconds(string text, bool zero, out double seconds) =>
        double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out seconds) && double.IsFinite(seconds) && (zero ? seconds >= 0 : seconds > 0);

    private static bool TryWhole(string text, long least, long most, out long value) =>
        long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out value) && value >= least && value <= most;

    private delegate bool TryParse<T>(string text, out T value);

    private static bool Ok<T>(bool ok, T parsed, out T value)
    {
        value = parsed;
        return ok;
    }

    /// <summary>An option whose text is turned into a value by <paramref name="parse"/> (false: refused with <paramref name="expects"/>).</summary>
    private static Option<T> Parsed<T>(string name, string description, string helpName, T fallback, TryParse<T> parse, string expects)
    {
        var option = new Option<T>(name) { Description = description, HelpName = helpName };
        if (fallback is not null)
        {
            option.DefaultValueFactory = _ => fallback;
        }

        option.CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return fallback;
            }

            string text = result.Tokens[0].Value;
            if (parse(text, out T value))
            {
                return value;
            }

            result.AddError($"{name} expects {expects}, not '{text}'");
            return fallback;
        };
        return option;
    }
}
