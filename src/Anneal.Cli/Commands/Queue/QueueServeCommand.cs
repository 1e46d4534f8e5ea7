using System.CommandLine;
using Anneal.Cli.Reporting;
using Anneal.Queue.Database;
using Anneal.Queue.Web;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue serve`: the read-only status page, until Ctrl+C or SIGTERM (exit 130).</summary>
public static class QueueServeCommand
{
    public static Command Create(CliContext context)
    {
        var db = QueueAccess.DbOption();
        var urls = new Option<string>("--urls")
        {
            Description = $"Where to listen; several separated by ';'. Default {StatusSite.DefaultUrls} (this machine only); give http://0.0.0.0:8080 to let other machines in.",
            DefaultValueFactory = _ => StatusSite.DefaultUrls,
            HelpName = "url",
        };
        var command = new Command("serve", "Serve a read-only status page: counts by state, running jobs with their best so far, failures with their reason, each done job's report and files, and /health.");
        command.Options.Add(db);
        command.Options.Add(urls);
        command.SetAction(parse => Execute(parse.GetValue(db), parse.GetValue(urls)!, context));
        return command;
    }

    public static int Execute(string? db, string urls, CliContext context) =>
        QueueAccess.Run(context, db, checkSchema: true, async (_, cancel) =>
        {
            using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
            using var signals = context.HandleSignals ? new ShutdownSignals(stop) : null;
            var app = StatusSite.Build(QueueConnection.Resolve(db)!, urls);
            try
            {
                await StatusSite.RunAsync(app, stop.Token);
            }
            catch (IOException e)
            {
                context.Err.WriteLine($"anneal: cannot listen on {urls}: {e.Message}; give another --urls");
                return ExitCodes.InvalidInput;
            }

            return ExitCodes.Interrupted;
        });
}
