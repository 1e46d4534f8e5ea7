using System.Text.Json;
using Anneal.Core.DrivingRules;
using Anneal.Core.Model;
using Anneal.Formats.Input.Json;

namespace Anneal.Formats.Input.Csv;

internal sealed partial record SettingsFile
{
    private sealed partial class SettingsReader
    {
        private static readonly NumberRange DrivingMinutes = new(0, 24 * 60, "minutes", MinExclusive: true);
        private static readonly NumberRange SplitMinutes = new(0, 24 * 60, "minutes");
        private static readonly NumberRange SpanMinutes = new(0, 48 * 60, "minutes", MinExclusive: true);

        /// <summary>drivingRules: { "default": NAME, "sets": { NAME: { ... } } }; a set may start from another ("basedOn").</summary>
        private DrivingBook DrivingRules(JsonTree value, int line)
        {
            var sets = DrivingBook.Presets();
            if (!Object(value, line, "drivingRules"))
            {
                return DrivingBook.PresetsOnly;
            }

            var members = Members(value, SettingsKeys.Driving, "drivingRules.");
            foreach (var (key, keyLine, v) in members)
            {
                if (key == "sets" && Object(v, keyLine, "drivingRules.sets"))
                {
                    foreach (var (name, setLine, _, set) in v.Members)
                    {
                        if (OneSet(name.Trim(), set, setLine, sets) is { } made)
                        {
                            sets[made.Name] = made;
                        }
                    }
                }
            }

            DrivingRuleSet? fallback = null;
            foreach (var (key, keyLine, v) in members)
            {
                if (key == "default")
                {
                    fallback = Named(v, keyLine, "drivingRules.default", sets);
                }
            }

            return new DrivingBook(sets, fallback);
        }

        private DrivingRuleSet? Named(JsonTree v, int line, string key, Dictionary<string, DrivingRuleSet> sets)
        {
            string known = string.Join(", ", new DrivingBook(sets, null).Names());
            string name = v.Kind == JsonTokenType.String ? (v.Text ?? string.Empty).Trim() : string.Empty;
            if (name.Length == 0)
            {
                Add(line, key, v.Shown, "not a rule set's name", "write a name in quotes, one of " + known);
                return null;
            }

            if (sets.TryGetValue(name, out var set))
            {
                return set;
            }

            if (string.Equals(name, DrivingBook.None, StringComparison.OrdinalIgnoreCase))
            {
                return null;
            }

            var near = Closest.Find(name, new DrivingBook(sets, null).Names());
            Add(line, key, v.Shown, "unknown driving-rule set", (near is not null ? $"did you mean '{near}'? " : string.Empty) + "use one of " + known + ", or define it under drivingRules.sets");
            return null;
        }

        private DrivingRuleSet? OneSet(string name, JsonTree set, int line, Dictionary<string, DrivingRuleSet> sets)
        {
            string path = $"drivingRules.sets.{name}";
            if (name.Length == 0 || string.Equals(name, DrivingBook.None, StringComparison.OrdinalIgnoreCase))
            {
                Add(line, path, name, "not a usable rule set's name", $"name the set with letters, digits or dashes, other than '{DrivingBook.None}'");
                return null;
            }

            if (!Object(set, line, path))
            {
                return null;
            }

            var members = Members(set, SettingsKeys.DrivingSet, path + ".");
            DrivingRuleSet? basis = null;
            foreach (var (key, keyLine, v) in members)
            {
                if (key == "basedOn")
                {
                    basis = Named(v, keyLine, path + ".basedOn", sets);
                }
            }

            double drive = basis?.DrivingBeforeBreak ?? double.NaN, full = basis?.BreakMinutes ?? double.NaN;
            double first = basis?.SplitFirst ?? 0, second = basis?.SplitSecond ?? 0;
            double daily = basis?.DailyDriving ?? double.NaN, span = basis?.DutySpan ?? double.NaN;
            bool waiting = basis?.WaitingCounts ?? false, hard = true;
            double price = 0;
            bool bad = false;
            int priceLine = line;
            foreach (var (key, keyLine, v) in members)
            {
                string at = $"{path}.{key}";
                switch (key)
                {
                    case "waitingCounts":
                    case "hard":
                        if (v.Kind is not (JsonTokenType.True or JsonTokenType.False))
                        {
                            Add(keyLine, at, v.Shown, "not true or false", key == "hard" ? "write true (never broken) or false (broken at pricePerMinute)" : "write true (a long enough wait is a break) or false");
                            bad = true;
                        }
                        else if (key == "hard")
                        {
                            hard = v.Kind == JsonTokenType.True;
                        }
                        else
                        {
                            waiting = v.Kind == JsonTokenType.True;
                        }

                        break;
                    case "basedOn":
                        break;
                    default:
                        var range = key switch
                        {
                            "pricePerMinute" => Limits.Price,
                            "splitFirstMinutes" or "splitSecondMinutes" => SplitMinutes,
                            "dutySpanMinutes" => SpanMinutes,
                            _ => DrivingMinutes,
                        };
                        if (Within(v, keyLine, at, range, Meaning(key)) is not double d)
                        {
                            bad = true;
                            break;
                        }

                        switch (key)
                        {
                            case "drivingBeforeBreakMinutes": drive = d; break;
                            case "breakMinutes": full = d; break;
                            case "splitFirstMinutes": first = d; break;
                            case "splitSecondMinutes": second = d; break;
                            case "dailyDrivingMinutes": daily = d; break;
                            case "dutySpanMinutes": span = d; break;
                            default: price = d; priceLine = keyLine; break;
                        }

                        break;
                }
            }

            foreach (var (key, value) in new[] { ("drivingBeforeBreakMinutes", drive), ("breakMinutes", full), ("dailyDrivingMinutes", daily), ("dutySpanMinutes", span) })
            {
                if (double.IsNaN(value))
                {
                    Add(line, $"{path}.{key}", null, "missing", $"give {Meaning(key)}, or start the set from a preset with \"basedOn\": \"{DrivingPresets.EuName}\"");
                    bad = true;
                }
            }

            if ((first > 0) != (second > 0))
            {
                Add(line, $"{path}.splitFirstMinutes", null, "a split break needs both parts", "give splitFirstMinutes and splitSecondMinutes both above 0 (e.g. 15 and 30), or both 0 for no split");
                bad = true;
            }

            if (!hard && price <= 0 && !bad)
            {
                Add(priceLine, $"{path}.pricePerMinute", price.ToString(System.Globalization.CultureInfo.InvariantCulture),
                    "soft driving rules need a positive price", "give pricePerMinute > 0, or make the set hard");
                bad = true;
            }

            if (bad)
            {
                return null;
            }

            return new DrivingRuleSet
            {
                Name = name,
                Source = basis is not null && basis.Source.Length > 0 ? $"based on {basis.Name}: {basis.Source}" : string.Empty,
                DrivingBeforeBreak = drive,
                BreakMinutes = full,
                SplitFirst = first,
                SplitSecond = second,
                DailyDriving = daily,
                DutySpan = span,
                WaitingCounts = waiting,
                Rule = hard ? Rule.HardRule : Rule.Soft(price),
            };
        }

        private static string Meaning(string key) => key switch
        {
            "drivingBeforeBreakMinutes" => "the longest driving before a break, in minutes",
            "breakMinutes" => "the length of a full break, in minutes",
            "splitFirstMinutes" => "the first, shorter part of a split break, in minutes (0: no split)",
            "splitSecondMinutes" => "the part that completes a split break, in minutes (0: no split)",
            "dailyDrivingMinutes" => "the most driving in the day, in minutes",
            "dutySpanMinutes" => "the longest duty span, depot to depot with breaks, in minutes",
            _ => "the price per minute over the day's driving or the duty span",
        };
    }
}
