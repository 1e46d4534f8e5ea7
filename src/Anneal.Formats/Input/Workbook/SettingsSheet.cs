using System.Globalization;
using System.Text.Json;
using Anneal.Formats.Input.Csv;
using Anneal.Formats.Input.Json;

namespace Anneal.Formats.Input.Workbook;

/// <summary>
/// The workbook's optional <c>settings</c> sheet: one setting per row, a <c>key</c> column holding the settings.json key
/// (nested keys joined with dots, e.g. <c>rules.timeWindows.pricePerMinute</c>) and a <c>value</c> column. It is read
/// into the same tree as settings.json, so both are checked by one reader and mean the same.
/// </summary>
internal static class SettingsSheet
{
    public const string Name = "settings";

    public static SettingsFile Read(CsvTable table, ProblemList problems)
    {
        HeaderCheck.Check(table, ["key", "value"], [], problems);
        if (!HeaderCheck.Require(table, "key", "the settings key, e.g. timeSeconds or rules.timeWindows.hard", problems)
            | !HeaderCheck.Require(table, "value", "the setting's value", problems))
        {
            return new SettingsFile();
        }

        var root = new JsonTree(JsonTokenType.StartObject, 1);
        foreach (var row in table.Rows)
        {
            var cells = new Cells(table, row, problems);
            var key = cells.Text("key");
            if (key.Length == 0)
            {
                cells.Report("key", null, "the key is empty", "write a settings key, e.g. timeSeconds, or clear the row");
                continue;
            }

            var path = key.Split('.', StringSplitOptions.TrimEntries);
            var parent = root;
            for (int i = 0; i < path.Length - 1; i++)
            {
                parent = Child(parent, path[i], row.Line);
            }

            parent.Members.Add((path[^1], row.Line, 1, Value(path[^1], cells.Text("value"), row.Line)));
        }

        // A problem about a key points at the key cell; one about a value at the value cell.
        return SettingsFile.FromTree(root, (line, key, value, problem, fix) =>
        {
            string column = value is null ? "key" : "value";
            problems.Add(new InputProblem(table.File, line, column, value, $"{key}: {problem}", fix)
            {
                Sheet = table.Sheet,
                Cell = table.CellName(line, column),
            });
        });
    }

    /// <summary>The object under <paramref name="key"/>, made on first use so that rows of one rule gather under it.</summary>
    private static JsonTree Child(JsonTree parent, string key, int line)
    {
        foreach (var (k, _, _, v) in parent.Members)
        {
            if (string.Equals(k, key, StringComparison.OrdinalIgnoreCase) && v.IsObject)
            {
                return v;
            }
        }

        var child = new JsonTree(JsonTokenType.StartObject, line);
        parent.Members.Add((key, line, 1, child));
        return child;
    }

    /// <summary>A cell as the JSON value it stands for: a list for solvers, else a number, true/false, or text.</summary>
    private static JsonTree Value(string key, string text, int line)
    {
        if (string.Equals(key, "solvers", StringComparison.OrdinalIgnoreCase))
        {
            var list = new JsonTree(JsonTokenType.StartArray, line);
            foreach (var name in text.Split([',', ';', ' '], StringSplitOptions.RemoveEmptyEntries))
            {
                list.Items.Add(new JsonTree(JsonTokenType.String, line) { Text = name });
            }

            return list;
        }

        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double number))
        {
            return new JsonTree(JsonTokenType.Number, line) { Number = number, Text = text };
        }

        return text.ToLowerInvariant() switch
        {
            "true" or "yes" => new JsonTree(JsonTokenType.True, line) { Text = "true" },
            "false" or "no" => new JsonTree(JsonTokenType.False, line) { Text = "false" },
            _ => new JsonTree(JsonTokenType.String, line) { Text = text },
        };
    }
}
