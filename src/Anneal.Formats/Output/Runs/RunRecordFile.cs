using System.Text.Json;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Output.Artifacts;

namespace Anneal.Formats.Output.Runs;

/// <summary>Writes and reads run.json (same JSON conventions as summary.json).</summary>
public static class RunRecordFile
{
    public const string FileName = "run.json";

    public static void Write(string path, RunRecord record) =>
        AtomicFile.Write(path, stream => JsonSerializer.Serialize(stream, record, SummaryJsonWriter.Options));

    /// <exception cref="InvalidDataException">when the file is not a run record.</exception>
    public static RunRecord Read(string path)
    {
        try
        {
            using var stream = File.OpenRead(path);
            var record = JsonSerializer.Deserialize<RunRecord>(stream, SummaryJsonWriter.Options);
            return record ?? throw new InvalidDataException($"{path} is empty");
        }
        catch (JsonException e)
        {
            throw new InvalidDataException($"{path} is not a run record: {e.Message}", e);
        }
    }

    /// <summary>The record of a finished run, from its summary.</summary>
    public static RunRecord Record(RunContext run) => new(
        RunRecord.CurrentVersion,
        System.IO.Path.GetFullPath(run.Input.Path),
        run.Input.Format,
        run.Instance.Objective.ToText(),
        Routes(run.Instance, run.Plan),
        run.Summary.Solvers,
        run.Summary.Chosen,
        run.Summary.Seed,
        run.Summary.TimeLimitSeconds,
        run.Summary.Interrupted,
        run.Summary.GeneratedAt);

    /// <summary>The plan as run.json keeps it: ids, so that it survives re-reading the input.</summary>
    public static IReadOnlyList<RouteRecord> Routes(Instance instance, PlanEvaluation evaluation)
    {
        var routes = new List<RouteRecord>(evaluation.Routes.Count);
        foreach (var r in evaluation.Routes)
        {
            var stops = new string[r.Stops.Length];
            for (int k = 0; k < stops.Length; k++)
            {
                stops[k] = instance.Stops[r.Stops[k]].Id;
            }

            routes.Add(new RouteRecord(instance.Vehicles[r.Vehicle].Id, stops));
        }

        return routes;
    }
}
