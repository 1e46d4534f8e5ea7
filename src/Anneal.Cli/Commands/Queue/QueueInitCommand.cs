using System.CommandLine;
using Anneal.Queue.Database;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue init`: creates or migrates the schema; safe to run again.</summary>
public static class QueueInitCommand
{
    public static Command Create(CliContext context)
    {
        var db = QueueAccess.DbOption();
        var command = new Command("init", "Create the queue's tables in the database, or migrate them to this version; running it again changes nothing.");
        command.Options.Add(db);
        command.SetAction(parse => Execute(parse.GetValue(db), context));
        return command;
    }

    public static int Execute(string? db, CliContext context) =>
        QueueAccess.Run(context, db, checkSchema: false, async (source, cancel) =>
        {
            int before = await QueueSchema.InitAsync(source, cancel);
            context.Out.WriteLine(before == QueueSchema.Version
                ? $"The queue schema is at version {QueueSchema.Version} already; nothing to do."
                : before == 0
                    ? $"Created the queue schema, version {QueueSchema.Version}."
                    : $"Migrated the queue schema from version {before} to {QueueSchema.Version}.");
            return ExitCodes.Success;
        });
}
