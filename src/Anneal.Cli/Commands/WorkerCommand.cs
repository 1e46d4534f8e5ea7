using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Formats.Output;
using Anneal.Queue.Database;
using Anneal.Worker;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;

namespace Anneal.Cli.Commands;

/// <summary>`anneal worker`: solves every job dropped into an inbox folder, unattended, until stopped (or once with --once).</summary>
public static class WorkerCommand
{
    public static Command Create(CliContext context)
    {
        var inbox = new Option<string?>("--inbox") { Description = "Folder where jobs are dropped (a job folder, a .zip of one, or a benchmark file).", HelpName = "dir" };
        var outbox = new Option<string?>("--outbox") { Description = "Folder where each solved job's folder appears, complete.", HelpName = "dir" };
        // Taken as text and checked with the other settings, so that every wrong one is named at once.
        var time = new Option<string?>("--time") { Description = "Search budget per job, for jobs whose settings give none. Default 60.", HelpName = "seconds" };
        var jobs = new Option<string?>("--jobs") { Description = "Jobs solved at the same time. Default 1.", HelpName = "n" };
        var threads = new Option<string?>("--threads") { Description = "Independent searches per solver within a job. Default 1.", HelpName = "n" };
        var solvers = new Option<string?>("--solvers") { Description = "Comma-separated solver names for every job. Default: each job's list, else all that apply.", HelpName = "list" };
        var once = new Option<bool>("--once") { Description = "Solve what the inbox (or the queue) holds, then exit (for cron and scripts)." };
        var create = new Option<bool>("--create-folders") { Description = "Create the inbox (and the folders beside it) when it does not exist; otherwise a missing inbox is refused." };
        var db = Queue.QueueAccess.DbOption();
        db.Description = "Serve the PostgreSQL queue at this Npgsql connection string instead of an inbox (also from ANNEAL_DB or Queue:ConnectionString).";
        var command = new Command("worker",
            "Watch an inbox, or serve the PostgreSQL queue (--db), and solve every job; settings also come from appsettings.json and ANNEAL_Worker__* variables. Exit 0 after --once, 130 when stopped.");
        foreach (Option option in new Option[] { inbox, outbox, time, jobs, threads, solvers, once, create, db })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var settings = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
            Put(settings, nameof(WorkerOptions.Inbox), parse.GetValue(inbox));
            Put(settings, nameof(WorkerOptions.Outbox), parse.GetValue(outbox));
            Put(settings, nameof(WorkerOptions.TimeSeconds), parse.GetValue(time));
            Put(settings, nameof(WorkerOptions.ConcurrentJobs), parse.GetValue(jobs));
            Put(settings, nameof(WorkerOptions.ThreadsPerJob), parse.GetValue(threads));
            Put(settings, nameof(WorkerOptions.Solvers), parse.GetValue(solvers));
            if (parse.GetValue(create))
            {
                Put(settings, nameof(WorkerOptions.CreateFolders), "true");
            }

            var connection = UsesQueue(parse.GetValue(db), parse.GetValue(inbox) is not null, context);
            if (connection is { Length: 0 })
            {
                return ExitCodes.InvalidInput;
            }

            if (connection is not null)
            {
                settings[QueueConnection.SettingKey] = connection;
            }

            return Execute(settings, parse.GetValue(once), context, queue: connection is not null);
        });
        return command;
    }

    /// <param name="settings">Command-line settings as configuration keys ("Worker:Inbox"); they override every other source.</param>
    /// <param name="queue">Serve the database queue (settings[Queue:ConnectionString]) instead of the inbox.</param>
    public static int Execute(IReadOnlyDictionary<string, string?> settings, bool once, CliContext context, bool queue = false)
    {
        var run = new WorkerRun { Once = once, UsesFolders = !queue };
        try
        {
            // Building already reads the settings (the shutdown timeout is one of them), so it may refuse them too.
            using var host = WorkerHost.Build(settings, run, s => s.AddAnnealHost(), queue ? (s, c) => s.AddQueueWorker(c) : null);
            var lifetime = host.Services.GetRequiredService<IHostApplicationLifetime>();
            using var outside = context.Cancel.Register(lifetime.StopApplication);

            // The host's own handling stops it on the first signal; this one ends the process on the second.
            using var signals = context.HandleSignals ? new ShutdownSignals(lifetime.StopApplication) : null;
            host.Run();
        }
        catch (Exception e) when (Invalid(e) is { } invalid)
        {
            foreach (var failure in invalid.Failures)
            {
                context.Err.WriteLine("anneal: " + failure);
            }

            return ExitCodes.InvalidInput;
        }

        if (run.Failure is not null)
        {
            context.Err.WriteLine("anneal: " + run.Failure.Message);
            return run.Failure switch
            {
                OutputException => ExitCodes.OutputFailed,
                QueueException => ExitCodes.QueueUnavailable,
                _ => ExitCodes.InternalError,
            };
        }

        if (run.Unpublished > 0)
        {
            context.Err.WriteLine($"anneal: {run.Unpublished} job(s) could not be published: the outbox has no space left; they are back in the inbox");
            return ExitCodes.OutputFailed;
        }

        return run.FinishedByItself ? ExitCodes.Success : ExitCodes.Interrupted;
    }

    /// <summary>
    /// The queue's connection string when the worker serves the database: --db, or (without --inbox) ANNEAL_DB or
    /// Queue:ConnectionString when no inbox is configured either. Null: the folder worker. Empty: refused (both set).
    /// </summary>
    private static string? UsesQueue(string? db, bool inboxGiven, CliContext context)
    {
        if (db is not null)
        {
            if (inboxGiven)
            {
                context.Err.WriteLine("anneal: give either --inbox (the folder worker) or --db (the database worker), not both");
                return string.Empty;
            }

            return db;
        }

        if (inboxGiven)
        {
            return null;
        }

        var configured = WorkerHost.AddSettingsSources(new ConfigurationBuilder()).Build();
        string? connection = QueueConnection.Resolve(null, configured);
        if (connection is null)
        {
            return null;
        }

        if (!string.IsNullOrWhiteSpace(configured[WorkerOptions.Section + ":" + nameof(WorkerOptions.Inbox)]))
        {
            context.Err.WriteLine("anneal: both Worker:Inbox and a queue database (ANNEAL_DB or Queue:ConnectionString) are configured: give --inbox or --db to choose");
            return string.Empty;
        }

        return connection;
    }

    private static void Put(Dictionary<string, string?> settings, string key, string? value)
    {
        if (value is not null)
        {
            settings[WorkerOptions.Section + ":" + key] = value;
        }
    }

    /// <summary>Settings refused at start-up, however the host wrapped them.</summary>
    private static OptionsValidationException? Invalid(Exception e) => e switch
    {
        OptionsValidationException v => v,
        AggregateException a => a.InnerExceptions.Select(Invalid).FirstOrDefault(v => v is not null),
        _ => e.InnerException is null ? null : Invalid(e.InnerException),
    };
}
