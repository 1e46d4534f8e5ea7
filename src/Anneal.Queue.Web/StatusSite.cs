using System.Net;
using Anneal.Queue.Database;
using Anneal.Queue.Jobs;
using Anneal.Worker;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Console;
using Npgsql;

namespace Anneal.Queue.Web;

/// <summary>
/// `anneal queue serve`: a read-only status page over the queue. Only GET routes exist (anything else is 405), pages are
/// rendered on the server and refresh themselves, files come from the database, and no page shows the connection
/// string. It listens on 127.0.0.1 unless told otherwise.
/// </summary>
public static class StatusSite
{
    public const string DefaultUrls = "http://127.0.0.1:8080";

    private const string Policy = "default-src 'none'; img-src 'self' data:; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

    /// <summary>Builds the site; <see cref="WebApplication.StartAsync"/> starts it.</summary>
    /// <exception cref="QueueException">when the connection string cannot be read.</exception>
    public static WebApplication Build(string connection, string urls)
    {
        var db = QueueConnection.Open(connection);
        var builder = WebApplication.CreateEmptyBuilder(new WebApplicationOptions { ContentRootPath = Environment.CurrentDirectory });
        WorkerHost.AddSettingsSources(builder.Configuration);
        builder.Logging.SetMinimumLevel(LogLevel.Information);
        builder.Logging.AddFilter("Microsoft", LogLevel.Warning);
        builder.Logging.AddConfiguration(builder.Configuration.GetSection("Logging"));
        WorkerHost.AddConsoleLog(builder.Logging, builder.Services);
        builder.Services.Configure<ConsoleLoggerOptions>(o => o.LogToStandardErrorThreshold = LogLevel.Trace);
        builder.WebHost.UseKestrelCore().UseUrls(urls);
        builder.Services.AddRoutingCore();
        builder.Services.AddSingleton(db);

        var app = builder.Build();
        var log = app.Services.GetRequiredService<ILoggerFactory>().CreateLogger("Anneal.Queue.Web");
        app.Use(async (context, next) =>
        {
            var headers = context.Response.Headers;
            headers.ContentSecurityPolicy = Policy;
            headers.XContentTypeOptions = "nosniff";
            headers["Referrer-Policy"] = "no-referrer";
            headers.CacheControl = "no-store";
            await next(context);
        });

        app.MapGet("/", (CancellationToken cancel) => Page(db, log, connection, async () =>
            Html(StatusPages.Overview(await StatusQuery.ReadAsync(db, 20, cancel), DateTimeOffset.Now)), cancel));

        app.MapGet("/jobs/{id:long}", (long id, CancellationToken cancel) => Page(db, log, connection, async () =>
        {
            var job = await ResultReader.FindAsync(db, id, cancel);
            return job is null
                ? Html(StatusPages.Problem("No such job", $"There is no job {id} in the queue.", DateTimeOffset.Now), StatusCodes.Status404NotFound)
                : Html(StatusPages.Job(job, await ResultReader.ListAsync(db, id, cancel), await ResultReader.EventsAsync(db, id, cancel), DateTimeOffset.Now));
        }, cancel));

        app.MapGet("/jobs/{id:long}/files/{**name}", (long id, string name, CancellationToken cancel) => Page(db, log, connection, async () =>
            await ResultReader.FileAsync(db, id, name, cancel) is { } file
                ? Results.Bytes(file.Content, file.MediaType)
                : Html(StatusPages.Problem("No such file", $"Job {id} has no file {name}.", DateTimeOffset.Now), StatusCodes.Status404NotFound), cancel));

        app.MapGet("/health", async (CancellationToken cancel) =>
        {
            try
            {
                await using var conn = await db.OpenConnectionAsync(cancel);
                await QueueSchema.CheckAsync(conn, cancel);
                return Results.Json(new { status = "ok", schemaVersion = QueueSchema.Version });
            }
            catch (Exception e) when (e is QueueException || Worker.Backoff.IsTransient(e))
            {
                return Results.Json(new { status = "unavailable", reason = Reason(e, connection) }, statusCode: StatusCodes.Status503ServiceUnavailable);
            }
        });

        app.Lifetime.ApplicationStarted.Register(() =>
        {
            if (log.IsEnabled(LogLevel.Information))
            {
                string database = ConnectionText.Describe(connection);
                string urls = string.Join(", ", app.Urls);
                ServeLog.Started(log, database, urls);
            }
        });
        app.Lifetime.ApplicationStopped.Register(() => ServeLog.Stopped(log));
        return app;
    }

    /// <summary>Runs the site until <paramref name="stop"/> fires.</summary>
    /// <exception cref="IOException">when the address cannot be listened on.</exception>
    public static async Task RunAsync(WebApplication app, CancellationToken stop)
    {
        await app.StartAsync(stop);
        try
        {
            await Task.Delay(Timeout.Infinite, stop);
        }
        catch (OperationCanceledException)
        {
            // Asked to stop.
        }

        await app.StopAsync(CancellationToken.None);
        await app.DisposeAsync();
    }

    /// <summary>Renders a page after checking the schema; a database that does not answer gives a 503 page saying so.</summary>
    private static async Task<IResult> Page(NpgsqlDataSource db, ILogger log, string connection, Func<Task<IResult>> render, CancellationToken cancel)
    {
        try
        {
            await using (var conn = await db.OpenConnectionAsync(cancel))
            {
                await QueueSchema.CheckAsync(conn, cancel);
            }

            return await render();
        }
        catch (Exception e) when (e is QueueException || Worker.Backoff.IsTransient(e))
        {
            string reason = Reason(e, connection);
            ServeLog.DatabaseUnavailable(log, reason);
            return Html(StatusPages.Problem("The queue cannot be read", "The queue's database does not answer as it should: " + reason, DateTimeOffset.Now),
                StatusCodes.Status503ServiceUnavailable);
        }
    }

    private static string Reason(Exception e, string connection) =>
        e is QueueException ? e.Message : ConnectionText.Scrub(e.Message, connection);

    private static IResult Html(string page, int status = StatusCodes.Status200OK) =>
        Results.Content(page, "text/html; charset=utf-8", System.Text.Encoding.UTF8, status);

    /// <summary>True for a listen address on this machine only.</summary>
    public static bool IsLocal(string url) =>
        Uri.TryCreate(url, UriKind.Absolute, out var u) && (u.IsLoopback || (IPAddress.TryParse(u.Host, out var ip) && IPAddress.IsLoopback(ip)));
}
