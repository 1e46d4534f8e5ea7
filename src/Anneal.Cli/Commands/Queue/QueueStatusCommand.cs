using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Anneal.Queue.Database;
using Anneal.Queue.Jobs;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue status`: counts by state, the running jobs with their best so far, the latest failures.</summary>
public static class QueueStatusCommand
{
    private const int Listed = 10;

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true, Encoder = Anneal.Formats.Output.JsonText.Encoder };

    public static Command Create(CliContext context)
    {
        var db = QueueAccess.DbOption();
        var json = new Option<bool>("--json") { Description = "One JSON object (queued, running, done, failed, runningJobs, failedJobs) instead of text." };
        var command = new Command("status", "Show how many jobs are queued, running, done and failed, and each running job's worker, attempt, elapsed time and best so far.");
        command.Options.Add(db);
        command.Options.Add(json);
        command.SetAction(parse => Execute(parse.GetValue(db), parse.GetValue(json), context));
        return command;
    }

    public static int Execute(string? db, bool json, CliContext context) =>
        QueueAccess.Run(context, db, checkSchema: true, async (source, cancel) =>
        {
            var status = await StatusQuery.ReadAsync(source, Listed, cancel);
            if (json)
            {
                context.Out.WriteLine(JsonSerializer.Serialize(new
                {
                    status.Queued,
                    status.Running,
                    status.Done,
                    status.Failed,
                    SchemaVersion = QueueSchema.Version,
                    status.RunningJobs,
                    status.FailedJobs,
                }, Json));
            }
            else
            {
                Print(context.Out, status);
            }

            return ExitCodes.Success;
        });

    private static void Print(TextWriter w, QueueStatus s)
    {
        w.WriteLine($"queued {s.Queued}, running {s.Running}, done {s.Done}, failed {s.Failed}");
        if (s.RunningJobs.Count > 0)
        {
            w.WriteLine("running:");
            w.WriteLine($"  {"job",-8} {"name",-20} {"worker",-28} {"attempt",7} {"elapsed",9}  best so far");
            foreach (var j in s.RunningJobs)
            {
                w.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"  {j.Id,-8} {Cut(j.Name, 20),-20} {Cut(j.Worker, 28),-28} {j.Attempt,7} {j.ElapsedSeconds,7:0.0} s  {Best(j.Solvers)}"));
            }
        }

        if (s.FailedJobs.Count > 0)
        {
            w.WriteLine(s.Failed > s.FailedJobs.Count ? $"failed (latest {s.FailedJobs.Count}):" : "failed:");
            foreach (var f in s.FailedJobs)
            {
                w.WriteLine($"  {f.Id,-8} {Cut(f.Name, 20),-20} {f.Reason.ReplaceLineEndings(" / ")}");
            }
        }
    }

    /// <summary>"sa 1234.50 (feasible), tabu …", or "starting" before the first report.</summary>
    public static string Best(IReadOnlyList<SolverProgress> solvers) =>
        solvers.Count == 0
            ? "starting"
            : string.Join(", ", solvers.Select(p => string.Create(CultureInfo.InvariantCulture,
                $"{p.Solver} {(p.BestObjective is { } b ? b.ToString("0.00", CultureInfo.InvariantCulture) : "-")} ({(p.Feasible ? "feasible" : "infeasible")})")));

    private static string Cut(string text, int width) => text.Length <= width ? text : text[..(width - 1)] + "…";
}
