using Microsoft.Extensions.Logging;

namespace Anneal.Queue.Worker;

/// <summary>
/// Renews a running job's lease every HeartbeatSeconds and stores its best so far. When the database does not answer
/// the search goes on (the lease is renewed when it answers again); when the claim is no longer the job's, the
/// search is stopped, since its result would be refused.
/// </summary>
public sealed class Heartbeat : IAsyncDisposable
{
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _loop;

    public Heartbeat(Claims claims, QueueJob job, QueueOptions options, QueueProgress progress, Action onLost, ILogger log, TimeProvider clock)
    {
        _loop = Task.Run(async () =>
        {
            bool failing = false;
            while (!_stop.IsCancellationRequested)
            {
                try
                {
                    await Task.Delay(TimeSpan.FromSeconds(options.HeartbeatSeconds), clock, _stop.Token);
                }
                catch (OperationCanceledException)
                {
                    return;
                }

                try
                {
                    if (!await claims.HeartbeatAsync(job, options.LeaseSeconds, progress.Json(), _stop.Token))
                    {
                        Lost = true;
                        QueueLog.LeaseLost(log, job.Id, job.Claim);
                        onLost();
                        return;
                    }

                    failing = false;
                }
                catch (OperationCanceledException)
                {
                    return;
                }
                catch (Exception e) when (Backoff.IsTransient(e))
                {
                    if (!failing)
                    {
                        QueueLog.HeartbeatFailed(log, job.Id, e.Message);
                        failing = true;
                    }
                }
            }
        });
    }

    /// <summary>The claim was found superseded: another worker holds the job now.</summary>
    public bool Lost { get; private set; }

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync();
        await _loop;
        _stop.Dispose();
    }
}
