namespace Anneal.Queue.Worker;

/// <summary>Waits that double from one second up to a ceiling while the database does not answer, and start again once it does.</summary>
public sealed class Backoff(double maxSeconds)
{
    private double _next = 1;

    public bool Failing { get; private set; }

    /// <summary>The wait before the next attempt; each call doubles the one after.</summary>
    public TimeSpan Fail()
    {
        Failing = true;
        double wait = Math.Min(_next, maxSeconds);
        _next = Math.Min(_next * 2, maxSeconds);
        return TimeSpan.FromSeconds(wait);
    }

    /// <returns>True when this ends a run of failures.</returns>
    public bool Succeed()
    {
        bool was = Failing;
        Failing = false;
        _next = 1;
        return was;
    }

    /// <summary>A failure of the database or the network, as opposed to a fault in the program.</summary>
    public static bool IsTransient(Exception e) =>
        e is Npgsql.NpgsqlException or TimeoutException or System.Net.Sockets.SocketException or IOException
        || (e is InvalidOperationException && e.InnerException is not null && IsTransient(e.InnerException));
}
