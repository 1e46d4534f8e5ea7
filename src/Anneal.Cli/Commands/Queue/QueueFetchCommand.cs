using System.CommandLine;
using System.Globalization;
using System.Text;
using Anneal.Cli.Reporting;
using Anneal.Queue.Inputs;
using Anneal.Queue.Jobs;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue fetch`: writes each job's run folder (the files `solve` writes) from the database into DIR/&lt;job id&gt;/.</summary>
public static class QueueFetchCommand
{
    public const string ErrorFile = "error.txt";

    public static Command Create(CliContext context)
    {
        var db = QueueAccess.DbOption();
        var ids = new Argument<long[]>("jobs") { Description = "Job ids, as `submit` printed them.", Arity = ArgumentArity.ZeroOrMore };
        var all = new Option<bool>("--all") { Description = "Every job with a result or a failure." };
        var since = new Option<string?>("--since") { Description = "Jobs finished at or after this time (ISO 8601, e.g. 2026-03-01 or 2026-03-01T18:00; local time unless it says otherwise).", HelpName = "time" };
        var output = SharedOptions.Out("Folder that receives one folder per job, named by its id (required).");
        var command = new Command("fetch", "Write each job's run folder (routes.csv, summary.json, trace.csv, run.json, pictures, report.html) into DIR/<job id>/; a failed job gets error.txt.");
        command.Arguments.Add(ids);
        foreach (Option option in new Option[] { db, all, since, output })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var given = parse.GetValue(ids) ?? [];
            string? sinceText = parse.GetValue(since);
            int ways = (given.Length > 0 ? 1 : 0) + (parse.GetValue(all) ? 1 : 0) + (sinceText is null ? 0 : 1);
            if (ways != 1)
            {
                context.Err.WriteLine("anneal: name the jobs to fetch in one way: job ids, --all, or --since TIME");
                return ExitCodes.InvalidInput;
            }

            if (parse.GetValue(output) is not { Length: > 0 } folder)
            {
                context.Err.WriteLine("anneal: --out DIR is required: the folder that receives one folder per job");
                return ExitCodes.InvalidInput;
            }

            DateTimeOffset? from = null;
            if (sinceText is not null)
            {
                if (!DateTimeOffset.TryParse(sinceText, CultureInfo.InvariantCulture, DateTimeStyles.AssumeLocal, out var parsed))
                {
                    context.Err.WriteLine($"anneal: --since '{sinceText}' is not a time; write it as 2026-03-01 or 2026-03-01T18:00 (local time), or with an offset such as +01:00 or Z");
                    return ExitCodes.InvalidInput;
                }

                from = parsed;
            }

            return Execute(parse.GetValue(db), new JobSelection(given.Length > 0 ? given : null, from), folder, context);
        });
        return command;
    }

    public static int Execute(string? db, JobSelection which, string outDir, CliContext context) =>
        QueueAccess.Run(context, db, checkSchema: true, async (source, cancel) =>
        {
            var jobs = await ResultReader.FindAsync(source, which, cancel);
            string root = OutputFolder.Create(outDir);
            int code = ExitCodes.Success;
            if (which.Ids is { } ids)
            {
                foreach (long missing in ids.Except(jobs.Select(j => j.Id)))
                {
                    context.Err.WriteLine($"anneal: there is no job {missing} in the queue");
                    code = ExitCodes.InvalidInput;
                }
            }

            int written = 0;
            foreach (var job in jobs)
            {
                if (job.HasResult)
                {
                    string folder = ResultFolder.Write(root, job.Id, await ResultReader.FilesAsync(source, job.Id, cancel));
                    string note = job.State == "done" ? (job.Interrupted ? " (interrupted: its worker was stopping; kept as the result)" : string.Empty)
                        : $" (an interrupted plan; the job is {job.State} again and its next run replaces it)";
                    context.Out.WriteLine($"job {job.Id} ({job.Name}): {folder}{note}");
                    written++;
                }
                else if (job.State == "failed")
                {
                    string text = $"Job {job.Id} ({job.Name}) failed after {job.Attempt} attempt(s).\n{job.Error}\n";
                    string folder = ResultFolder.Write(root, job.Id, [new StoredFile(ErrorFile, Encoding.UTF8.GetBytes(text))]);
                    context.Out.WriteLine($"job {job.Id} ({job.Name}): failed; the reason is in {Path.Combine(folder, ErrorFile)}");
                    written++;
                }
                else
                {
                    context.Err.WriteLine($"job {job.Id} ({job.Name}) is {job.State}: no result yet");
                }
            }

            if (which.Ids is null)
            {
                context.Out.WriteLine($"{written} job folder(s) written to {root}");
            }

            return code;
        });
}
