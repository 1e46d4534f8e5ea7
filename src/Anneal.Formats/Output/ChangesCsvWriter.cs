using Anneal.Core.Model;
using Anneal.Core.Replanning;

namespace Anneal.Formats.Output;

/// <summary>changes.csv of a re-plan: one row per stop that is new, cancelled, moved to another vehicle (or left unserved) or retimed beyond the stability tolerance.</summary>
public static class ChangesCsvWriter
{
    public const string FileName = "changes.csv";

    /// <summary>The columns, in order (the README documents each).</summary>
    public static IReadOnlyList<string> Columns { get; } = ["stop", "old_vehicle", "new_vehicle", "old_start", "new_start", "reason", "note"];

    public static void Write(string path, Instance job, DayChanges changes) => AtomicFile.WriteText(path, writer => Write(writer, job, changes));

    public static void Write(TextWriter writer, Instance job, DayChanges changes)
    {
        using var csv = CsvOutput.Open(writer);
        foreach (var name in Columns)
        {
            csv.WriteField(name);
        }

        csv.NextRecord();
        foreach (var c in changes.Stops)
        {
            foreach (var field in new[] { c.Stop, c.OldVehicle ?? string.Empty, c.NewVehicle ?? string.Empty, Clock(job, c.OldStart), Clock(job, c.NewStart), DayChanges.ReasonText(c.Reason), c.Note })
            {
                csv.WriteField(field);
            }

            csv.NextRecord();
        }

        csv.Flush();
    }

    private static string Clock(Instance job, double? time) => time is double t ? job.Units.Format(t) : string.Empty;
}
