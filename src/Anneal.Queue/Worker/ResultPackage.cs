using System.Text.Json;
using System.Text.Json.Serialization;
using Anneal.Core.Model;
using Anneal.Jobs;
using Anneal.Queue.Inputs;

namespace Anneal.Queue.Worker;

/// <summary>Everything a finished run stores, gathered before the one transaction that stores it.</summary>
public sealed record ResultPackage(
    string Instance,
    string Solver,
    string ObjectiveKind,
    double Objective,
    double Distance,
    double Duration,
    int Vehicles,
    bool Feasible,
    int Unserved,
    bool Interrupted,
    double Seconds,
    string SummaryJson,
    IReadOnlyList<StoredFile> Files,
    IReadOnlyList<PlanRow> Plan,
    BenchRun? Bench)
{
    /// <summary>The run's files as its artifact writers left them in <paramref name="folder"/>, plus its verdict and plan rows.</summary>
    public static ResultPackage From(JobRun run, string folder, double? budgetSeconds)
    {
        var files = FilesIn(folder);
        var best = run.Outcome.Best;
        var plan = best.Evaluation;
        var instance = run.Instance;
        var rows = new List<PlanRow>();
        foreach (var route in plan.Routes)
        {
            for (int k = 0; k < route.Stops.Length; k++)
            {
                var v = route.Visits[k];
                rows.Add(new PlanRow(instance.Vehicles[route.Vehicle].Id, k + 1, instance.Stops[route.Stops[k]].Id, v.Arrival, v.Start, v.Departure, v.Wait, v.Late));
            }
        }

        double seconds = 0;
        foreach (var judged in run.Outcome.Results)
        {
            seconds = Math.Max(seconds, judged.Result.Seconds);
        }

        string summary = File.ReadAllText(Path.Combine(folder, Formats.Output.SummaryJsonWriter.FileName));
        BenchRun? bench = null;
        if (budgetSeconds is { } budget && run.Outcome.Results.Count == 1)
        {
            var only = run.Outcome.Results[0];
            bench = new BenchRun(only.Result.Solver, run.Plan.Seed, budget, only.Evaluation.Objective, only.Evaluation.VehiclesUsed, only.Evaluation.Distance,
                only.Evaluation.Feasible, only.Evaluation.Routes.Count > 0, only.Result.SecondsToBest, only.Result.Seconds, only.Result.LowerBound, only.Result.BoundOnly);
        }

        return new ResultPackage(instance.Name, best.Result.Solver, instance.Objective.ToText(), plan.Objective, plan.Distance, plan.Duration, plan.VehiclesUsed,
            plan.Feasible, plan.Unserved.Count, run.Interrupted, seconds, summary, files, rows, bench);
    }

    /// <summary>
    /// Saves everything but the files, for the worker that started this run in its own process (`anneal run-job
    /// --package`): it reads the package back with <see cref="Load"/> and the files from the run's folder.
    /// </summary>
    public void Save(string path) =>
        Formats.Output.AtomicFile.Write(path, stream => JsonSerializer.Serialize(stream, this with { Files = [] }, Json));

    /// <exception cref="IOException">when the file or the folder cannot be read.</exception>
    /// <exception cref="JsonException">when the file is not a package.</exception>
    public static ResultPackage Load(string path, string folder)
    {
        var package = JsonSerializer.Deserialize<ResultPackage>(File.ReadAllBytes(path), Json) ?? throw new JsonException($"{path} holds no result");
        return package with { Files = FilesIn(folder) };
    }

    private static readonly JsonSerializerOptions Json = new() { NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals };

    /// <summary>Every file under <paramref name="folder"/>, by relative path with '/' (the order is ordinal).</summary>
    public static List<StoredFile> FilesIn(string folder)
    {
        var files = new List<StoredFile>();
        foreach (var path in Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories))
        {
            files.Add(new StoredFile(Path.GetRelativePath(folder, path).Replace(Path.DirectorySeparatorChar, '/'), File.ReadAllBytes(path)));
        }

        files.Sort((a, b) => string.CompareOrdinal(a.Path, b.Path));
        return files;
    }

    public static string MediaType(string name) => Path.GetExtension(name).ToLowerInvariant() switch
    {
        ".csv" => "text/csv; charset=utf-8",
        ".json" => "application/json",
        ".png" => "image/png",
        ".svg" => "image/svg+xml",
        ".html" => "text/html; charset=utf-8",
        ".txt" => "text/plain; charset=utf-8",
        ".geojson" => "application/geo+json",
        _ => "application/octet-stream",
    };
}

/// <summary>One visit of the written plan (routes.csv as a table row).</summary>
public sealed record PlanRow(string Vehicle, int Sequence, string Stop, double Arrival, double Start, double Departure, double Wait, double Late);

/// <summary>A benchmark run's measures (one solver), stored in bench_results beside the job's result.</summary>
public sealed record BenchRun(
    string Solver, int Seed, double BudgetSeconds, double ObjectiveValue, int Vehicles, double Distance, bool Feasible, bool HasRoutes, double SecondsToBest, double Seconds,
    double? LowerBound, bool BoundOnly);
