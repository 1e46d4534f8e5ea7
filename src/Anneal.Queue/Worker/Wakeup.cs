using Microsoft.Extensions.Logging;
using Npgsql;

namespace Anneal.Queue.Worker;

/// <summary>
/// LISTEN on the jobs channel on a connection of its own, so an idle worker claims a new job as soon as it is
/// committed. A NOTIFY is delivered only to listeners connected at that moment and never replayed, so after every
/// (re)connection the worker is woken once to poll; polling every PollSeconds covers the rest.
/// </summary>
public sealed class Wakeup : IAsyncDisposable
{
    private readonly SemaphoreSlim _signal = new(0, 1);
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _loop;

    public Wakeup(NpgsqlDataSource db, QueueOptions options, double pollSeconds, ILogger log, TimeProvider clock)
    {
        _loop = Task.Run(async () =>
        {
            var backoff = new Backoff(options.RetryMaxSeconds);
            while (!_stop.IsCancellationRequested)
            {
                try
                {
                    await using var conn = await db.OpenConnectionAsync(_stop.Token);
                    conn.Notification += (_, _) => Wake();
                    await using (var listen = new NpgsqlCommand($"LISTEN {Jobs.Submitter.Channel}", conn))
                    {
                        await listen.ExecuteNonQueryAsync(_stop.Token);
                    }

                    backoff.Succeed();
                    Wake();
                    while (!_stop.IsCancellationRequested)
                    {
                        await conn.WaitAsync(_stop.Token);
                    }
                }
                catch (OperationCanceledException)
                {
                    return;
                }
                catch (Exception e) when (Backoff.IsTransient(e))
                {
                    var wait = backoff.Fail();
                    QueueLog.ListenerLost(log, e.Message, pollSeconds);
                    try
                    {
                        await Task.Delay(wait, clock, _stop.Token);
                    }
                    catch (OperationCanceledException)
                    {
                        return;
                    }
                }
            }
        });
    }

    /// <summary>Completes when a job may be waiting (a notification, a reconnection) or after <paramref name="timeout"/>.</summary>
    public Task WaitAsync(TimeSpan timeout, CancellationToken cancel) => _signal.WaitAsync(timeout, cancel);

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync();
        await _loop;
        _stop.Dispose();
        _signal.Dispose();
    }

    private void Wake()
    {
        try
        {
            _signal.Release();
        }
        catch (SemaphoreFullException)
        {
            // A wake-up is already pending; one is enough.
        }
    }
}
