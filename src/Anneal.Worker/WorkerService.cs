using Anneal.Formats.Output;
using Anneal.Worker.Arrival;
using Anneal.Worker.Isolation;
using Anneal.Jobs;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace Anneal.Worker;

/// <summary>
/// The worker's loop: recover dead workers' jobs, claim jobs up to the concurrency limit, keep the status file fresh,
/// and on a stop request let every running job write its best plan before returning. The stopping token is the only
/// stop signal and reaches every solver.
/// </summary>
public sealed class WorkerService(
    IOptions<WorkerOptions> options, WorkerRun run, JobRunner runner, RunWriter writer, SolverProcess solverProcess, IHostApplicationLifetime lifetime, ILoggerFactory logs, TimeProvider clock)
    : BackgroundService
{
    private readonly ILogger _log = logs.CreateLogger("Anneal.Worker");

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var o = options.Value;
        var folders = WorkerFolders.From(o);
        WorkerIdentity me;
        try
        {
            folders.Create();
            me = WorkerIdentity.Start(folders.Working, clock.GetUtcNow());
        }
        catch (Exception e) when (e is OutputException or IOException or UnauthorizedAccessException)
        {
            Fail(e is OutputException ? e : new OutputException($"cannot start in {folders.Working}: {e.Message}", e));
            return;
        }

        using (me)
        {
            try
            {
                await Loop(o, folders, me, stoppingToken);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                Fail(e);
            }
        }
    }

    private async Task Loop(WorkerOptions o, WorkerFolders folders, WorkerIdentity me, CancellationToken stop)
    {
        var settle = new SettleWatch(folders.Inbox, TimeSpan.FromSeconds(o.SettleSeconds), o.RequireReadyMarker, clock);
        var claimer = new JobClaimer(folders, me.Folder, settle, clock);
        var recovery = new DeadWorkerRecovery(folders, me.Id, claimer, o.MaxRetries, _log, clock);
        var processor = new JobProcessor(o, folders, me.Id, claimer, runner, writer, new ChildRun(solverProcess), _log, clock);
        var status = new StatusFile(StatusFile.PathFor(folders.Working, me.Id), me.Id, clock.GetUtcNow());
        WorkerLog.WorkerStarted(_log, me.Id, folders.Inbox, folders.Outbox, folders.Failed, o.ConcurrentJobs, o.TimeSeconds, run.Once ? "; stops when the inbox is empty" : string.Empty);

        var running = new List<Task>();
        var backoff = new OutboxBackoff();
        var nextRecovery = DateTimeOffset.MinValue;
        var nextStatus = DateTimeOffset.MinValue;
        while (!stop.IsCancellationRequested)
        {
            var now = clock.GetUtcNow();
            try
            {
                if (now >= nextRecovery)
                {
                    recovery.Run();
                    nextRecovery = now + TimeSpan.FromSeconds(o.RecoverSeconds);
                }

                running.RemoveAll(t => t.IsCompleted);

                // After a full outbox, --once claims nothing more (its jobs wait in the inbox for the next run).
                bool claiming = !backoff.Paused(now) && !(run.Once && backoff.Unpublished > 0);
                while (claiming && running.Count < o.ConcurrentJobs && !stop.IsCancellationRequested && claimer.TryClaimNext() is { } job)
                {
                    running.Add(Start(job, processor, status, backoff, stop));
                }

                if (now >= nextStatus)
                {
                    status.Write("running", now);
                    nextStatus = now + TimeSpan.FromSeconds(o.StatusSeconds);
                }

                if (run.Once && running.Count == 0 && (!claimer.InboxHasJobs() || backoff.Unpublished > 0))
                {
                    run.FinishedByItself = true;
                    run.Unpublished = backoff.Unpublished;
                    break;
                }
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException or OutputException)
            {
                // A shared folder that hiccups must not end the night's work: log and poll again.
                WorkerLog.FolderError(_log, me.Id, e.Message);
            }

            // WhenAny never throws, so a stop request simply ends the wait; a finished job ends it early too.
            var poll = Task.Delay(TimeSpan.FromSeconds(o.PollSeconds), clock, stop);
            await Task.WhenAny([poll, .. running]);
        }

        if (running.Count > 0)
        {
            WorkerLog.WorkerStopping(_log, me.Id, running.Count);
            TryWrite(status, "stopping");
            await Task.WhenAll(running);
        }

        TryWrite(status, "stopped");
        WorkerLog.WorkerStopped(_log, me.Id);
        if (run.FinishedByItself)
        {
            lifetime.StopApplication();
        }
    }

    private Task Start(ClaimedJob job, JobProcessor processor, StatusFile status, OutboxBackoff backoff, CancellationToken stop)
    {
        var progress = new JobProgress(job, _log, clock);
        status.Started(progress);
        WorkerLog.JobClaimed(_log, job.Id, job.Entry.Name);

        // Solvers block their threads for the whole budget; long-running tasks keep them off the thread pool.
        return Task.Factory.StartNew(() =>
        {
            (JobResult Result, string Where) done;
            try
            {
                done = processor.Process(job, progress, stop);
            }
            catch (Exception e)
            {
                // The job stays in this worker's folder; the next start-up recovers it with a retry counted.
                WorkerLog.JobNotHandedOn(_log, job.Id, e.Message, job.Path);
                done = (JobResult.Retry, job.Path);
            }

            if (done.Result == JobResult.NoSpace)
            {
                var wait = backoff.Full(clock.GetUtcNow());
                WorkerLog.OutboxFull(_log, wait.TotalSeconds);
            }
            else if (done.Result is JobResult.Solved or JobResult.Interrupted or JobResult.Requeued)
            {
                backoff.Published();
            }

            status.Finished(job, done.Result, done.Where, clock.GetUtcNow());
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
    }

    private void TryWrite(StatusFile status, string state)
    {
        try
        {
            status.Write(state, clock.GetUtcNow());
        }
        catch (OutputException e)
        {
            WorkerLog.StatusNotWritten(_log, e.Message);
        }
    }

    private void Fail(Exception e)
    {
        run.Failure = e;
        WorkerLog.WorkerCannotRun(_log, e.Message);
        lifetime.StopApplication();
    }
}
