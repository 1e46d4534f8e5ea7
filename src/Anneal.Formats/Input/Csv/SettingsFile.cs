using System.Text.Json;
using Anneal.Core.Model;
using Anneal.Formats.Input.Json;

namespace Anneal.Formats.Input.Csv;

/// <summary>settings.json: objective, search budget, solvers, seed, travel speed and hard/soft rules.</summary>
internal sealed partial record SettingsFile
{
    public const string FileName = "settings.json";

    public const double DefaultSpeedKmh = 40;
    public const double DefaultDetour = 1.3;

    public JobSettings Job { get; init; } = new();
    public Objective Objective { get; init; } = Objective.Cost;
    public RuleSet Rules { get; init; } = RuleSet.AllHard;
    public double SpeedKmh { get; init; } = DefaultSpeedKmh;
    public double DetourFactor { get; init; } = DefaultDetour;

    /// <summary>The driving-rule sets vehicles may name, and the default (settings.json's <c>drivingRules</c>).</summary>
    public DrivingBook Driving { get; init; } = DrivingBook.PresetsOnly;

    private static readonly string[] TopKeys = SettingsKeys.Top;
    private static readonly string[] TravelKeys = SettingsKeys.Travel;
    private static readonly (string Name, string PriceKey)[] RuleKeys = SettingsKeys.Rules;

    public static SettingsFile Read(byte[] bytes, ProblemList problems)
    {
        JsonTree root;
        try
        {
            root = JsonTree.Parse(bytes);
        }
        catch (JsonSyntaxException e)
        {
            problems.Add(e.Problem(FileName, "mend the JSON at that place (comments and trailing commas are allowed)"));
            return new SettingsFile();
        }

        if (!root.IsObject)
        {
            problems.Add(new InputProblem(FileName, root.Line, null, root.Shown, "the settings must be one JSON object", "wrap the settings in { ... }") { Position = root.Column });
            return new SettingsFile();
        }

        return FromTree(root, (line, key, value, problem, fix) => problems.Add(
            new InputProblem(FileName, line, null, value, problem, fix) { JsonPath = key, Position = root.Locate(key, line)?.Column }));
    }

    /// <summary>Where a settings problem goes: the line (or row), the key's path, the value as written, what is wrong, the fix.</summary>
    public delegate void ProblemSink(int line, string key, string? value, string problem, string fix);

    /// <summary>The settings held by <paramref name="root"/>, an object built from settings.json or from a workbook's settings sheet.</summary>
    public static SettingsFile FromTree(JsonTree root, ProblemSink sink) => new SettingsReader(sink).Top(root);

    private sealed partial class SettingsReader(ProblemSink sink)
    {
        public SettingsFile Top(JsonTree root)
        {
            var job = new JobSettings();
            var result = new SettingsFile();
            var stability = StabilityPrices.Default;
            foreach (var (key, line, value) in Members(root, TopKeys, string.Empty))
            {
                switch (key)
                {
                    case "objective":
                        if (value.Kind != JsonTokenType.String || !ObjectiveNames.TryParse(value.Text, out var objective))
                        {
                            Add(line, key, value.Shown, "unknown objective", "use one of " + ObjectiveNames.Accepted);
                            break;
                        }

                        job = job with { Objective = objective };
                        result = result with { Objective = objective };
                        break;
                    case "timeSeconds":
                        if (Within(value, line, key, Limits.TimeSeconds, "the search time budget in seconds") is double seconds)
                        {
                            job = job with { TimeSeconds = seconds };
                        }

                        break;
                    case "solvers":
                        job = job with { Solvers = Solvers(value, line) };
                        break;
                    case "seed":
                        if (value.Kind != JsonTokenType.Number || value.Number != Math.Floor(value.Number) || value.Number is < int.MinValue or > int.MaxValue)
                        {
                            Add(line, key, value.Shown, "not a whole number", "give the random seed as a whole number, e.g. 1");
                            break;
                        }

                        job = job with { Seed = (int)value.Number };
                        break;
                    case "travel":
                        result = Travel(value, line, result);
                        break;
                    case "rules":
                        result = result with { Rules = Rules(value, line) };
                        break;
                    case "stability":
                        stability = Stability(value, line);
                        break;
                    case "drivingRules":
                        result = result with { Driving = DrivingRules(value, line) };
                        break;
                    case "replan":
                        job = job with { Replan = Replan(value, line) };
                        break;
                }
            }

            return result with { Job = job, Rules = result.Rules with { Stability = stability } };
        }

        private SettingsFile Travel(JsonTree travel, int line, SettingsFile result)
        {
            if (!Object(travel, line, "travel"))
            {
                return result;
            }

            foreach (var (key, keyLine, value) in Members(travel, TravelKeys, "travel."))
            {
                double? v = key == "speedKmh"
                    ? Within(value, keyLine, "travel." + key, Limits.SpeedKmh, "the average speed in km/h")
                    : Within(value, keyLine, "travel." + key, Limits.DetourFactor, "the ratio of road to straight-line distance");
                if (v is double d)
                {
                    result = key == "speedKmh" ? result with { SpeedKmh = d } : result with { DetourFactor = d };
                }
            }

            return result;
        }

        private StabilityPrices Stability(JsonTree stability, int line)
        {
            var prices = StabilityPrices.Default;
            if (!Object(stability, line, "stability"))
            {
                return prices;
            }

            foreach (var (key, keyLine, value) in Members(stability, SettingsKeys.Stability, "stability."))
            {
                var range = key == "toleranceMinutes" ? Limits.TimeOfDay : Limits.Price;
                string meaning = key switch
                {
                    "pricePerMove" => "the price of a stop moved to another vehicle",
                    "pricePerMinute" => "the price per minute a stop's start moves beyond the tolerance",
                    _ => "the minutes a stop's start may move without a price",
                };
                if (Within(value, keyLine, "stability." + key, range, meaning) is double d)
                {
                    prices = key switch
                    {
                        "pricePerMove" => prices with { PerMove = d },
                        "pricePerMinute" => prices with { PerMinute = d },
                        _ => prices with { ToleranceMinutes = d },
                    };
                }
            }

            return prices;
        }

        /// <summary>"replan": { "from": "plan.csv", "now": "11:20", "without": ["van-3"] }; "from" names a file of the job folder.</summary>
        private JobReplan? Replan(JsonTree replan, int line)
        {
            if (!Object(replan, line, "replan"))
            {
                return null;
            }

            var result = new JobReplan(DefaultPlanFile, null, []);
            foreach (var (key, keyLine, value) in Members(replan, SettingsKeys.Replan, "replan."))
            {
                switch (key)
                {
                    case "from":
                        string from = value.Kind == JsonTokenType.String ? (value.Text ?? string.Empty).Trim() : string.Empty;
                        if (from.Length == 0 || from.Contains('/', StringComparison.Ordinal) || from.Contains('\\', StringComparison.Ordinal) || from is "." or "..")
                        {
                            Add(keyLine, "replan.from", value.Shown, "not the name of a file in the job folder",
                                "put the plan (a routes.csv of an earlier run) into the job folder and give its name, e.g. \"from\": \"plan.csv\"");
                            break;
                        }

                        result = result with { From = from };
                        break;
                    case "now":
                        if (value.Kind != JsonTokenType.String || value.Text is not { } clock || !TimeText.TryParseTime(clock, out double now))
                        {
                            Add(keyLine, "replan.now", value.Shown, "not a clock time", "give the clock time of the job's day that fixes the past as \"HH:MM\" (up to 47:59), e.g. \"now\": \"11:20\"");
                            break;
                        }

                        result = result with { Now = now };
                        break;
                    default:
                        var ids = new List<string>();
                        bool good = value.Kind == JsonTokenType.StartArray;
                        foreach (var item in good ? value.Items : [])
                        {
                            if (item.Kind == JsonTokenType.String && !string.IsNullOrWhiteSpace(item.Text))
                            {
                                ids.Add(item.Text.Trim());
                            }
                            else
                            {
                                good = false;
                            }
                        }

                        if (!good)
                        {
                            Add(keyLine, "replan.without", value.Shown, "not a list of vehicle ids", "list the vehicles taken out as strings, e.g. \"without\": [\"van-3\"]");
                            break;
                        }

                        result = result with { Without = ids };
                        break;
                }
            }

            return result;
        }

        /// <summary>The plan file of a re-plan when "replan" names none.</summary>
        public const string DefaultPlanFile = "plan.csv";

        private RuleSet Rules(JsonTree rules, int line)
        {
            var set = RuleSet.AllHard;
            if (!Object(rules, line, "rules"))
            {
                return set;
            }

            var names = new string[RuleKeys.Length];
            for (int i = 0; i < names.Length; i++)
            {
                names[i] = RuleKeys[i].Name;
            }

            foreach (var (key, keyLine, value) in Members(rules, names, "rules."))
            {
                int r = Array.IndexOf(names, key);
                var rule = OneRule(value, keyLine, key, RuleKeys[r].PriceKey);
                set = r switch
                {
                    0 => set with { TimeWindows = rule },
                    1 => set with { Capacity = rule },
                    2 => set with { ShiftEnd = rule },
                    3 => set with { MaxDuration = rule },
                    _ => set with { Unserved = rule },
                };
            }

            return set;
        }

        private Rule OneRule(JsonTree value, int line, string name, string priceKey)
        {
            if (!Object(value, line, "rules." + name))
            {
                return Rule.HardRule;
            }

            bool hard = true;
            double price = 0;
            bool priceReported = false;
            int priceLine = line;
            foreach (var (key, keyLine, v) in Members(value, ["hard", priceKey], $"rules.{name}."))
            {
                if (key == "hard")
                {
                    if (v.Kind is not (JsonTokenType.True or JsonTokenType.False))
                    {
                        Add(keyLine, $"rules.{name}.hard", v.Shown, "not true or false", "write true (never broken) or false (broken at a price)");
                        continue;
                    }

                    hard = v.Kind == JsonTokenType.True;
                }
                else if (v.Kind != JsonTokenType.Number || !double.IsFinite(v.Number))
                {
                    Add(keyLine, $"rules.{name}.{priceKey}", v.Shown, "not a number", "give the price as a number, e.g. 2.5");
                    priceReported = true;
                }
                else if (!Limits.Price.Contains(v.Number))
                {
                    Add(keyLine, $"rules.{name}.{priceKey}", v.Shown, Limits.Problem(Limits.Price), Limits.Fix(Limits.Price, "the price"));
                    priceReported = true;
                }
                else
                {
                    price = v.Number;
                    priceLine = keyLine;
                }
            }

            if (!hard && price <= 0 && !priceReported)
            {
                Add(priceLine, $"rules.{name}.{priceKey}", price.ToString(System.Globalization.CultureInfo.InvariantCulture),
                    "a soft rule needs a positive price", $"give {priceKey} > 0, or make the rule hard");
                return Rule.HardRule;
            }

            // A hard rule keeps its price: for unserved it is the price of leaving out an optional stop that has no penalty
            // of its own; for the others it is unused, and `check` says so rather than dropping it silently.
            return hard ? new Rule(true, price) : Rule.Soft(price);
        }

        private List<string>? Solvers(JsonTree value, int line)
        {
            var list = new List<string>();
            if (value.Kind == JsonTokenType.StartArray)
            {
                foreach (var item in value.Items)
                {
                    if (item.Kind == JsonTokenType.String && !string.IsNullOrWhiteSpace(item.Text))
                    {
                        list.Add(item.Text.Trim());
                    }
                    else
                    {
                        Add(item.Line, "solvers", item.Shown, "not a solver name", "list solver names as strings, e.g. [\"sa\", \"tabu\"]");
                    }
                }

                return list;
            }

            Add(line, "solvers", value.Shown, "not a list of solver names", "write e.g. \"solvers\": [\"sa\", \"tabu\"]");
            return null;
        }

        private double? Within(JsonTree value, int line, string key, NumberRange range, string meaning)
        {
            if (value.Kind != JsonTokenType.Number || !double.IsFinite(value.Number))
            {
                Add(line, key, value.Shown, "not a number", Limits.Fix(range, meaning));
                return null;
            }

            if (!range.Contains(value.Number))
            {
                Add(line, key, value.Shown, Limits.Problem(range), Limits.Fix(range, meaning));
                return null;
            }

            return value.Number;
        }

        private bool Object(JsonTree value, int line, string key)
        {
            if (value.IsObject)
            {
                return true;
            }

            Add(line, key, value.Shown, "not a JSON object", "write it as { ... } with its keys inside");
            return false;
        }

        /// <summary>Known members of <paramref name="obj"/>; unknown and repeated keys are reported and skipped.</summary>
        private List<(string Key, int Line, JsonTree Value)> Members(JsonTree obj, IReadOnlyList<string> known, string path)
        {
            var result = new List<(string, int, JsonTree)>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var (rawKey, line, _, value) in obj.Members)
            {
                string? key = null;
                foreach (var k in known)
                {
                    if (string.Equals(k, rawKey, StringComparison.OrdinalIgnoreCase))
                    {
                        key = k;
                    }
                }

                if (key is null)
                {
                    var near = Closest.Find(rawKey, known);
                    Add(line, path + rawKey, null, "unknown settings key",
                        (near is not null ? $"did you mean '{near}'? " : string.Empty) + "accepted keys here: " + string.Join(", ", known));
                    continue;
                }

                if (!seen.Add(key))
                {
                    Add(line, path + rawKey, null, "the key appears twice", "keep one of them");
                    continue;
                }

                result.Add((key, line, value));
            }

            return result;
        }

        private void Add(int line, string key, string? value, string problem, string fix) => sink(line, key, value, problem, fix);
    }
}
