using System.Globalization;
using Anneal.Jobs;
using Anneal.Queue.Database;
using Anneal.Worker;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Npgsql;

namespace Anneal.Queue.Worker;

/// <summary>
/// The database worker's loop, shaped like the folder worker's: put back jobs whose lease ran out (every
/// RecoverSeconds), claim jobs up to the concurrency limit, sleep until a NOTIFY, a finished job or the next poll, and
/// on a stop request let every running job store its best plan before returning. A database that stops answering is
/// retried with backoff; running searches go on meanwhile.
/// </summary>
public sealed class QueueWorkerService(
    IOptions<WorkerOptions> options, IOptions<QueueOptions> queueOptions, WorkerRun run, JobRunner runner, RunWriter writer, Anneal.Worker.Isolation.SolverProcess solverProcess,
    IHostApplicationLifetime lifetime, ILoggerFactory logs, TimeProvider clock)
    : BackgroundService
{
    private readonly ILogger _log = logs.CreateLogger("Anneal.Queue.Worker");

    /// <summary>host-pid-random: readable in logs, unique across machines and restarts.</summary>
    public static string NewWorkerId()
    {
        var host = Environment.MachineName.ToCharArray();
        for (int i = 0; i < host.Length; i++)
        {
            host[i] = char.IsAsciiLetterOrDigit(host[i]) ? host[i] : '_';
        }

        return string.Create(CultureInfo.InvariantCulture, $"{(host.Length == 0 ? "host" : new string(host))}-{Environment.ProcessId}-{Guid.NewGuid().ToString("N")[..8]}");
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var o = options.Value;
        var q = queueOptions.Value;
        string connection = q.ConnectionString!;
        NpgsqlDataSource db;
        try
        {
            db = QueueConnection.Open(connection);
        }
        catch (QueueException e)
        {
            Fail(e);
            return;
        }

        await using (db)
        {
            try
            {
                await Loop(o, q, db, connection, stoppingToken);
            }
            catch (QueueException e)
            {
                Fail(e);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                Fail(new QueueException(ConnectionText.Scrub(e.Message, connection), e));
            }
        }
    }

    private async Task Loop(WorkerOptions o, QueueOptions q, NpgsqlDataSource db, string connection, CancellationToken stop)
    {
        string me = NewWorkerId();
        var backoff = new Backoff(q.RetryMaxSeconds);
        if (!await CheckSchema(db, backoff, stop))
        {
            return;
        }

        var claims = new Claims(db, me);
        var processor = new QueueJobProcessor(o, q, claims, new ResultStore(db, me), runner, writer, new Anneal.Worker.Isolation.ChildRun(solverProcess), me, _log, clock);
        if (_log.IsEnabled(LogLevel.Information))
        {
            string database = ConnectionText.Describe(connection);
            QueueLog.WorkerStarted(_log, me, database, o.ConcurrentJobs, o.TimeSeconds, q.LeaseSeconds, run.Once ? "; stops when the queue is empty" : string.Empty);
        }

        await using var wakeup = new Wakeup(db, q, o.PollSeconds, _log, clock);

        var running = new List<Task>();
        var nextSweep = DateTimeOffset.MinValue;
        while (!stop.IsCancellationRequested)
        {
            var wait = TimeSpan.FromSeconds(o.PollSeconds);
            try
            {
                var now = clock.GetUtcNow();
                if (now >= nextSweep)
                {
                    foreach (var e in await claims.RequeueExpiredAsync(o.MaxRetries, stop))
                    {
                        QueueLog.LeaseExpired(_log, e.Id, e.Name, e.DeadWorker, e.State == "failed"
                            ? $"failed for good after {e.Attempt} attempts"
                            : $"queued again for attempt {e.Attempt} (of at most {o.MaxRetries + 1})");
                    }

                    nextSweep = now + TimeSpan.FromSeconds(o.RecoverSeconds);
                }

                running.RemoveAll(t => t.IsCompleted);
                bool claimedNone = false;
                while (running.Count < o.ConcurrentJobs && !stop.IsCancellationRequested)
                {
                    if (await claims.ClaimAsync(q.LeaseSeconds, stop) is not { } job)
                    {
                        claimedNone = true;
                        break;
                    }

                    QueueLog.JobClaimed(_log, job.Id, job.Name, job.Attempt, job.Claim);
                    running.Add(Task.Run(() => processor.ProcessAsync(job, stop), CancellationToken.None));
                }

                if (backoff.Succeed())
                {
                    QueueLog.DatabaseBack(_log);
                }

                if (run.Once && running.Count == 0 && claimedNone && !await claims.AnyQueuedAsync(stop))
                {
                    run.FinishedByItself = true;
                    break;
                }
            }
            catch (Exception e) when (Backoff.IsTransient(e) && !stop.IsCancellationRequested)
            {
                wait = backoff.Fail();
                QueueLog.DatabaseUnreachable(_log, ConnectionText.Scrub(e.Message, connection), wait.TotalSeconds);
            }
            catch (OperationCanceledException) when (stop.IsCancellationRequested)
            {
                break;
            }

            // A NOTIFY, a finished job or the poll ends the wait; a stop request too.
            var woken = backoff.Failing ? Task.Delay(wait, clock, stop) : wakeup.WaitAsync(wait, stop);
            await Task.WhenAny([woken, .. running]);
        }

        if (running.Count > 0)
        {
            QueueLog.WorkerStopping(_log, me, running.Count);
            await Task.WhenAll(running);
        }

        QueueLog.WorkerStopped(_log, me);
        if (run.FinishedByItself)
        {
            lifetime.StopApplication();
        }
    }

    /// <summary>Waits (with backoff) for the database to answer, then refuses a schema of another version; false when stopped first.</summary>
    private async Task<bool> CheckSchema(NpgsqlDataSource db, Backoff backoff, CancellationToken stop)
    {
        while (!stop.IsCancellationRequested)
        {
            try
            {
                await using var conn = await db.OpenConnectionAsync(stop);
                await QueueSchema.CheckAsync(conn, stop);
                return true;
            }
            catch (Exception e) when (Backoff.IsTransient(e) && !stop.IsCancellationRequested)
            {
                var wait = backoff.Fail();
                QueueLog.DatabaseUnreachable(_log, ConnectionText.Scrub(e.Message, queueOptions.Value.ConnectionString!), wait.TotalSeconds);
                try
                {
                    await Task.Delay(wait, clock, stop);
                }
                catch (OperationCanceledException)
                {
                    return false;
                }
            }
            catch (OperationCanceledException)
            {
                return false;
            }
        }

        return false;
    }

    private void Fail(Exception e)
    {
        run.Failure = e;
        QueueLog.WorkerCannotRun(_log, e.Message);
        lifetime.StopApplication();
    }
}
