using Microsoft.Extensions.Logging;

namespace Anneal.Queue.Web;

/// <summary>Every message of `anneal queue serve`, with a stable event id (26xx).</summary>
internal static partial class ServeLog
{
    [LoggerMessage(EventId = 2601, EventName = "ServeStarted", Level = LogLevel.Information,
        Message = "Status page for the queue at {Database} on {Urls} (read-only)")]
    public static partial void Started(ILogger log, string database, string urls);

    [LoggerMessage(EventId = 2602, EventName = "DatabaseUnavailable", Level = LogLevel.Warning,
        Message = "A page could not be read from the queue database: {Reason}")]
    public static partial void DatabaseUnavailable(ILogger log, string reason);

    [LoggerMessage(EventId = 2603, EventName = "ServeStopped", Level = LogLevel.Information, Message = "Status page stopped")]
    public static partial void Stopped(ILogger log);
}
