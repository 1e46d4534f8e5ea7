using Anneal.Worker;
using Microsoft.Extensions.Configuration;
using Npgsql;

namespace Anneal.Queue.Database;

/// <summary>
/// Where the queue's database is: `--db CONN`, else the ANNEAL_DB variable, else Queue:ConnectionString in the settings
/// (appsettings.json next to the executable or in the current folder, ANNEAL_Queue__ConnectionString).
/// </summary>
public static class QueueConnection
{
    public const string EnvironmentVariable = "ANNEAL_DB";
    public const string SettingKey = "Queue:ConnectionString";

    public static string? Resolve(string? given, IConfiguration settings)
    {
        if (!string.IsNullOrWhiteSpace(given))
        {
            return given;
        }

        string? fromEnvironment = Environment.GetEnvironmentVariable(EnvironmentVariable);
        return !string.IsNullOrWhiteSpace(fromEnvironment) ? fromEnvironment : settings[SettingKey] is { Length: > 0 } fromSettings ? fromSettings : null;
    }

    /// <summary>Resolves from the settings every host reads.</summary>
    public static string? Resolve(string? given) =>
        Resolve(given, WorkerHost.AddSettingsSources(new ConfigurationBuilder()).Build());

    public static QueueException Missing() =>
        new($"no database given: pass --db CONN (an Npgsql connection string such as \"Host=db.example;Database=anneal;Username=anneal\"), set {EnvironmentVariable}, or put {SettingKey} in appsettings.json");

    /// <exception cref="QueueException">when the connection string cannot be read.</exception>
    public static NpgsqlDataSource Open(string connectionString)
    {
        try
        {
            var builder = new NpgsqlDataSourceBuilder(connectionString);
            if (string.IsNullOrEmpty(builder.ConnectionStringBuilder.ApplicationName))
            {
                builder.ConnectionStringBuilder.ApplicationName = "anneal";
            }

            return builder.Build();
        }
        catch (ArgumentException e)
        {
            throw new QueueException("the connection string cannot be read: " + ConnectionText.Scrub(e.Message, connectionString)
                + "; write it as Key=Value pairs separated by ';' (Host, Port, Database, Username, Password)");
        }
    }

    /// <summary>A driver or network error in words, with no password in it.</summary>
    public static QueueException Unreachable(Exception e, string connectionString) =>
        new($"cannot use the queue database {ConnectionText.Describe(connectionString)}: {ConnectionText.Scrub(Reason(e), connectionString)}", e);

    private static string Reason(Exception e)
    {
        // The socket's own message says more ("Connection refused") than the driver's wrapper.
        var inner = e;
        while (inner.InnerException is not null && inner is not PostgresException)
        {
            inner = inner.InnerException;
        }

        return inner == e || inner.Message.Length == 0 ? e.Message : $"{e.Message} ({inner.Message})";
    }
}
