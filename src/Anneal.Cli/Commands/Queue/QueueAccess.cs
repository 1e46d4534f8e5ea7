using System.CommandLine;
using Anneal.Queue.Database;
using Npgsql;

namespace Anneal.Cli.Commands.Queue;

/// <summary>The `--db` option and the one way every queue command opens, checks and leaves the database.</summary>
public static class QueueAccess
{
    public static Option<string?> DbOption() => new("--db")
    {
        Description = $"Npgsql connection string of the queue's database. Default: {QueueConnection.EnvironmentVariable}, else {QueueConnection.SettingKey} in appsettings.json.",
        HelpName = "conn",
    };

    /// <summary>
    /// Runs <paramref name="body"/> with the database open and its schema checked (unless <paramref name="checkSchema"/>
    /// is false, for `init`). A database that cannot be used ends in exit 5 with a message that holds no password.
    /// </summary>
    public static int Run(CliContext context, string? given, bool checkSchema, Func<NpgsqlDataSource, CancellationToken, Task<int>> body)
    {
        string? connection = QueueConnection.Resolve(given);
        if (connection is null)
        {
            context.Err.WriteLine("anneal: " + QueueConnection.Missing().Message);
            return ExitCodes.InvalidInput;
        }

        try
        {
            using var db = QueueConnection.Open(connection);
            return Body(db).GetAwaiter().GetResult();
        }
        catch (QueueException e)
        {
            context.Err.WriteLine("anneal: " + e.Message);
            return ExitCodes.QueueUnavailable;
        }
        catch (Exception e) when (e is NpgsqlException or TimeoutException)
        {
            context.Err.WriteLine("anneal: " + QueueConnection.Unreachable(e, connection).Message);
            return ExitCodes.QueueUnavailable;
        }

        async Task<int> Body(NpgsqlDataSource db)
        {
            if (checkSchema)
            {
                await using var conn = await db.OpenConnectionAsync(context.Cancel);
                await QueueSchema.CheckAsync(conn, context.Cancel);
            }

            return await body(db, context.Cancel);
        }
    }
}
