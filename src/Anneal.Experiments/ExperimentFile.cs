using System.Globalization;
using System.Text.Json;
using Anneal.Formats.Input;

namespace Anneal.Experiments;

/// <summary>
/// An experiment written down: a small JSON object whose every key is optional, so that the command line can fill in
/// or override any of them. Paths are relative to the experiment file's folder.
/// <code>
/// { "instances": ["../benchmarks/solomon", "jobs/*"], "solvers": ["sa", "tabu"], "seeds": 3, "firstSeed": 1,
///   "budgets": [5, 30], "iterations": null, "objective": "distance", "reference": "../benchmarks/bks.csv",
///   "jobs": 2, "out": "results/solomon" }
/// </code>
/// </summary>
public sealed record ExperimentFile
{
    public IReadOnlyList<string> Instances { get; init; } = [];
    public IReadOnlyList<string>? Solvers { get; init; }
    public int? Seeds { get; init; }
    public int? FirstSeed { get; init; }
    public IReadOnlyList<double>? Budgets { get; init; }
    public long? Iterations { get; init; }
    public string? Objective { get; init; }
    public string? Reference { get; init; }
    public int? Jobs { get; init; }
    public string? Out { get; init; }

    private static readonly string[] Keys = ["instances", "solvers", "seeds", "firstSeed", "budgets", "iterations", "objective", "reference", "jobs", "out"];

    /// <exception cref="InputException">when the file is missing, not JSON, or a key holds the wrong kind of value.</exception>
    public static ExperimentFile Read(string path)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "the experiment file cannot be read: " + e.Message, "give the path of a JSON experiment file"));
        }

        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(text, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException e)
        {
            throw new InputException(new InputProblem(path, (int?)(e.LineNumber + 1), null, null, "not valid JSON: " + e.Message, "write one JSON object, e.g. {\"instances\": [\"bench/solomon\"], \"solvers\": [\"sa\"]}"));
        }

        using (doc)
        {
            return Parse(doc.RootElement, path, Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".");
        }
    }

    private static ExperimentFile Parse(JsonElement root, string path, string folder)
    {
        var problems = new List<InputProblem>();
        if (root.ValueKind != JsonValueKind.Object)
        {
            throw new InputException(new InputProblem(path, null, null, null, "the experiment is not a JSON object", "write { \"instances\": [...], ... }"));
        }

        foreach (var property in root.EnumerateObject())
        {
            if (!Keys.Contains(property.Name, StringComparer.Ordinal))
            {
                problems.Add(new(path, null, property.Name, null, "unknown key", "use only " + string.Join(", ", Keys)));
            }
        }

        var reader = new Fields(root, path, problems);
        var file = new ExperimentFile
        {
            Instances = (reader.Strings("instances") ?? []).Select(p => Resolve(folder, p)).ToList(),
            Solvers = reader.Strings("solvers"),
            Seeds = (int?)reader.Whole("seeds"),
            FirstSeed = (int?)reader.Whole("firstSeed"),
            Budgets = reader.Numbers("budgets"),
            Iterations = reader.Whole("iterations"),
            Objective = reader.Text("objective"),
            Reference = reader.Text("reference") is { } r ? Resolve(folder, r) : null,
            Jobs = (int?)reader.Whole("jobs"),
            Out = reader.Text("out") is { } o ? Resolve(folder, o) : null,
        };
        if (problems.Count > 0)
        {
            throw new InputException(problems);
        }

        return file;
    }

    private static string Resolve(string folder, string path) => Path.IsPathRooted(path) ? path : Path.Combine(folder, path);

    /// <summary>Typed reads of optional keys; a wrong kind of value becomes a problem naming the key.</summary>
    private sealed class Fields(JsonElement root, string path, List<InputProblem> problems)
    {
        public string? Text(string key) => Get(key) is { } e ? e.ValueKind == JsonValueKind.String ? e.GetString() : Bad<string>(key, e, "a string") : null;

        public long? Whole(string key) => Get(key) is { } e ? e.ValueKind == JsonValueKind.Number && e.TryGetInt64(out long v) ? v : Bad<long>(key, e, "a whole number") : null;

        /// <summary>A list of strings; one comma-separated string is accepted too (as on the command line).</summary>
        public IReadOnlyList<string>? Strings(string key)
        {
            if (Get(key) is not { } e)
            {
                return null;
            }

            if (e.ValueKind == JsonValueKind.String)
            {
                return e.GetString()!.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            }

            if (e.ValueKind == JsonValueKind.Array && e.EnumerateArray().All(x => x.ValueKind == JsonValueKind.String))
            {
                return e.EnumerateArray().Select(x => x.GetString()!).ToList();
            }

            return Bad<IReadOnlyList<string>>(key, e, "a list of strings");
        }

        public IReadOnlyList<double>? Numbers(string key)
        {
            if (Get(key) is not { } e)
            {
                return null;
            }

            if (e.ValueKind == JsonValueKind.Number)
            {
                return [e.GetDouble()];
            }

            if (e.ValueKind == JsonValueKind.Array && e.EnumerateArray().All(x => x.ValueKind == JsonValueKind.Number))
            {
                return e.EnumerateArray().Select(x => x.GetDouble()).ToList();
            }

            return Bad<IReadOnlyList<double>>(key, e, "a number or a list of numbers (seconds)");
        }

        private JsonElement? Get(string key) => root.TryGetProperty(key, out var e) && e.ValueKind != JsonValueKind.Null ? e : null;

        private T? Bad<T>(string key, JsonElement e, string wanted)
        {
            problems.Add(new InputProblem(path, null, key, e.GetRawText(), "not " + wanted, string.Create(CultureInfo.InvariantCulture, $"give {key} as {wanted}")));
            return default;
        }
    }
}
