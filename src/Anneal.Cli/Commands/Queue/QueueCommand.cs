using System.CommandLine;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue`: jobs, results and benchmark runs in PostgreSQL, served by `anneal worker --db` on any number of machines.</summary>
public static class QueueCommand
{
    public static Command Create(CliContext context)
    {
        var command = new Command("queue", "Jobs and results in a PostgreSQL database, solved by `anneal worker --db` on any number of machines.");
        command.Subcommands.Add(QueueInitCommand.Create(context));
        command.Subcommands.Add(QueueSubmitCommand.Create(context));
        command.Subcommands.Add(QueueStatusCommand.Create(context));
        command.Subcommands.Add(QueueFetchCommand.Create(context));
        command.Subcommands.Add(QueueServeCommand.Create(context));
        return command;
    }
}
