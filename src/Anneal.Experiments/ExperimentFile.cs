using System.Globalization;
using System.Text.Json;
using Anneal.Formats.Input;
using Anneal.Formats.Input.Json;

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
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "there is no experiment file here", "give the path of a JSON experiment file"));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "the experiment file cannot be read: " + Anneal.Formats.FileTrouble.Reading(path, e),
                "give the path of a JSON experiment file"));
        }

        JsonTree root;
        try
        {
            root = JsonTree.Parse(bytes);
        }
        catch (JsonSyntaxException e)
        {
            throw new InputException(e.Problem(path, "mend the JSON at that place; an experiment is one object, e.g. {\"instances\": [\"bench/solomon\"], \"solvers\": [\"sa\"]}"));
        }

        return Parse(root, path, Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".");
    }

    private static ExperimentFile Parse(JsonTree root, string path, string folder)
    {
        var problems = new List<InputProblem>();
        if (!root.IsObject)
        {
            throw new InputException(new InputProblem(path, root.Line, null, root.Shown, "the experiment is not a JSON object", "write { \"instances\": [...], ... }") { Position = root.Column });
        }

        var values = new Dictionary<string, (int Line, int Column, JsonTree Value)>(StringComparer.Ordinal);
        foreach (var (key, line, column, value) in root.Members)
        {
            if (!Keys.Contains(key, StringComparer.Ordinal))
            {
                var near = Closest.Find(key, Keys);
                problems.Add(new(path, line, null, null, "unknown key", (near is not null ? $"did you mean '{near}'? " : string.Empty) + "the keys are " + string.Join(", ", Keys))
                {
                    JsonPath = key,
                    Position = column,
                });
            }
            else if (!values.TryAdd(key, (line, column, value)))
            {
                problems.Add(new(path, line, null, null, "the key appears twice", "keep one of them") { JsonPath = key, Position = column });
            }
        }

        var reader = new Fields(values, path, problems);
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

    /// <summary>Typed reads of optional keys; a wrong kind of value becomes a problem naming the key and its place.</summary>
    private sealed class Fields(Dictionary<string, (int Line, int Column, JsonTree Value)> values, string path, List<InputProblem> problems)
    {
        public string? Text(string key) => Get(key) is { } e ? e.Kind == JsonTokenType.String ? e.Text : Bad<string>(key, e, "a string") : null;

        public long? Whole(string key) =>
            Get(key) is { } e ? e.Kind == JsonTokenType.Number && e.Number == Math.Floor(e.Number) && Math.Abs(e.Number) < 1e15 ? (long)e.Number : Bad<long>(key, e, "a whole number") : null;

        /// <summary>A list of strings; one comma-separated string is accepted too (as on the command line).</summary>
        public IReadOnlyList<string>? Strings(string key)
        {
            if (Get(key) is not { } e)
            {
                return null;
            }

            if (e.Kind == JsonTokenType.String)
            {
                return e.Text!.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            }

            if (e.Kind == JsonTokenType.StartArray && e.Items.All(x => x.Kind == JsonTokenType.String))
            {
                return e.Items.Select(x => x.Text!).ToList();
            }

            return Bad<IReadOnlyList<string>>(key, e, "a list of strings");
        }

        public IReadOnlyList<double>? Numbers(string key)
        {
            if (Get(key) is not { } e)
            {
                return null;
            }

            if (e.Kind == JsonTokenType.Number)
            {
                return [e.Number];
            }

            if (e.Kind == JsonTokenType.StartArray && e.Items.All(x => x.Kind == JsonTokenType.Number))
            {
                return e.Items.Select(x => x.Number).ToList();
            }

            return Bad<IReadOnlyList<double>>(key, e, "a number or a list of numbers (seconds)");
        }

        private JsonTree? Get(string key) => values.TryGetValue(key, out var v) && v.Value.Kind != JsonTokenType.Null ? v.Value : null;

        private T? Bad<T>(string key, JsonTree e, string wanted)
        {
            problems.Add(new InputProblem(path, e.Line, null, e.Shown, "not " + wanted, string.Create(CultureInfo.InvariantCulture, $"give {key} as {wanted}"))
            {
                JsonPath = key,
                Position = e.Column,
            });
            return default;
        }
    }
}
