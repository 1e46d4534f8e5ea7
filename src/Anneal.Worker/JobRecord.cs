using System.Text.Json;
using Anneal.Formats.Output;

namespace Anneal.Worker;

/// <summary>
/// job.json in a published job folder: which claim produced it. Recovery reads it to tell a job that was published just
/// before its worker died (done; the leftover input is dropped) from one that was not (solved again).
/// </summary>
/// <param name="Input">The entry's name in the worker's folder, with its retry mark.</param>
/// <param name="Final">False for an interrupted plan whose job went back to the inbox; a later full run replaces the folder.</param>
public sealed record JobRecord(string Job, string Input, string Worker, int Attempt, DateTimeOffset ClaimedAt, DateTimeOffset FinishedAt, bool Interrupted, bool Final)
{
    public const string FileName = "job.json";

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true, Encoder = Anneal.Formats.Output.JsonText.Encoder };

    public void Write(string folder) =>
        AtomicFile.Write(Path.Combine(folder, FileName), stream => JsonSerializer.Serialize(stream, this, Json));

    /// <summary>The record of a published folder; null when it has none or it cannot be read (not the worker's, or damaged).</summary>
    public static JobRecord? TryRead(string folder)
    {
        try
        {
            using var stream = File.OpenRead(Path.Combine(folder, FileName));
            return JsonSerializer.Deserialize<JobRecord>(stream, Json);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or JsonException)
        {
            return null;
        }
    }
}
