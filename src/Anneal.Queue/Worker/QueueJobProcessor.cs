using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Jobs;
using Anneal.Queue.Inputs;
using Anneal.Queue.Jobs;
using Anneal.Worker;
using Anneal.Worker.Isolation;
using Microsoft.Extensions.Logging;

namespace Anneal.Queue.Worker;

/// <summary>
/// Solves one claimed job through the job runner every host uses, writes its files with the host's artifact writers,
/// and ends the claim in exactly one way: done, queued again, or failed. A database that stops answering does not
/// lose the run: storing is retried with backoff until it answers (or the worker's stop deadline passes).
/// </summary>
public sealed class QueueJobProcessor(
    WorkerOptions options, QueueOptions queue, Claims claims, ResultStore store, JobRunner runner, RunWriter writer, ChildRun child, string workerId, ILogger log, TimeProvider clock)
{
    public async Task ProcessAsync(QueueJob job, CancellationToken stop)
    {
        string scratch = Directory.CreateTempSubdirectory($"anneal-job-{job.Id}-").FullName;
        try
        {
            await SolveAsync(job, scratch, stop);
        }
        catch (Exception e) when (!Backoff.IsTransient(e))
        {
            // An unexpected fault: the job goes back with one more attempt counted, or fails once they are spent.
            string reason = $"{e.GetType().Name}: {e.Message}";
            bool spent = job.Attempt > options.MaxRetries;
            QueueLog.JobError(log, job.Id, job.Attempt, reason, spent ? "given up (its retries are spent)" : "queued again");
            await PersistAsync(job, ct => spent
                ? store.FailAsync(job, $"Given up after {job.Attempt} attempts; the last one failed with: {reason}", ct)
                : store.RetryAsync(job, reason, countAttempt: true, ct), stop);
        }
        finally
        {
            try
            {
                Directory.Delete(scratch, recursive: true);
            }
            catch (IOException)
            {
                // A temporary folder left behind is housekeeping, not correctness.
            }
        }
    }

    private async Task SolveAsync(QueueJob job, string scratch, CancellationToken stop)
    {
        JobPlan plan;
        JobRequest request;
        string located;
        try
        {
            var (reached, files) = await PersistAsync(job, ct => claims.InputsAsync(job.Id, ct), stop);
            if (!reached)
            {
                return;
            }

            (var input, located) = StoredInput.Open(InputKinds.Named(job.Kind), job.Name, files!, Path.Combine(scratch, "input"), string.Empty);
            request = Submitter.Request(job.Spec, options.TimeSeconds, options.ThreadsPerJob, options.Solvers);
            plan = runner.Prepare(input, request);
        }
        catch (Exception e) when (e is InputException or UnknownSolverException)
        {
            var problems = e is InputException bad ? bad.Problems.Select(p => p.ToString()).ToList() : [e.Message];
            QueueLog.JobInvalid(log, job.Id, problems.Count == 1 ? "1 problem" : $"{problems.Count} problems");
            await PersistAsync(job, ct => store.FailAsync(job, $"The input cannot be read: {string.Join(Environment.NewLine, problems)}", ct), stop);
            return;
        }

        if (stop.IsCancellationRequested)
        {
            await PersistAsync(job, ct => store.RetryAsync(job, null, countAttempt: false, ct), stop);
            return;
        }

        if (log.IsEnabled(LogLevel.Information))
        {
            string solvers = string.Join(",", plan.SolverNames);
            QueueLog.JobStarted(log, job.Id, plan.Instance.StopCount, solvers, plan.Seconds);
        }

        var progress = new QueueProgress(job.Id, log, clock);
        using var search = CancellationTokenSource.CreateLinkedTokenSource(stop);

        // The lease is renewed for the whole claim: the search, then drawing the pictures and storing the result.
        await using var heartbeat = new Heartbeat(claims, job, queue, progress, search.Cancel, log, clock);

        string folder = Directory.CreateDirectory(Path.Combine(scratch, "run")).FullName;
        double? benchBudget = job.Spec.ExperimentId is null ? null : plan.Seconds;

        // Solvers block their threads for the whole budget; a long-running task keeps them off the thread pool.
        var outcome = await Task.Factory.StartNew(
            () => options.Isolation == SolverIsolation.Process
                ? InChild(plan, request, located, scratch, folder, benchBudget, progress, search.Token)
                : InProcess(plan, folder, benchBudget, progress, search.Token),
            CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        ResultPackage result;
        switch (outcome)
        {
            case Solved solved:
                result = solved.Package;
                break;
            case NotSolved { Outcome: ChildOutcome.Failed failed }:
                // The same input would crash again: failed at once, with the reason, instead of costing its retries.
                QueueLog.SolverFailed(log, job.Id, failed.Reason);
                await EndUnsolvedAsync(job, ct => store.FailAsync(job, $"The job could not be solved: {failed.Reason}. The other solvers may still solve it (\"solvers\" in settings.json).", ct), stop);
                return;
            case NotSolved { Outcome: ChildOutcome.NoSpace full }:
                QueueLog.JobError(log, job.Id, job.Attempt, full.Reason, "queued again with no attempt counted (the worker's disk is full)");
                await EndUnsolvedAsync(job, ct => store.RetryAsync(job, full.Reason, countAttempt: false, ct), stop);
                return;
            default:
                // Stopped before it wrote a plan (the worker stops, or the lease was lost and the search stopped early).
                await EndUnsolvedAsync(job, ct => store.RetryAsync(job, null, countAttempt: false, ct), stop);
                return;
        }

        bool requeue = result.Interrupted && stop.IsCancellationRequested && options.OnShutdown == ShutdownChoice.Requeue;
        var now = clock.GetUtcNow();
        new JobRecord(job.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), job.Name, workerId, job.Attempt, job.ClaimedAt, now, result.Interrupted, Final: !requeue).Write(folder);
        result = result with { Files = ResultPackage.FilesIn(folder) };

        var (written, accepted) = await PersistAsync(job, ct => store.CompleteAsync(job, result, requeue ? ClaimEnd.Requeued : ClaimEnd.Done, ct), stop);
        if (written && !accepted)
        {
            QueueLog.ResultRefused(log, job.Id, job.Claim);
        }
        else if (written)
        {
            string said = !result.Interrupted ? "solved" : requeue ? "interrupted (plan stored, job queued again)" : "interrupted (kept as its result)";
            QueueLog.JobStored(log, job.Id, said, result.Solver, result.Objective, result.Feasible ? "feasible" : "infeasible", result.Vehicles, result.Seconds);
        }
    }

    /// <summary>Ends a claim that has no plan to store; a claim taken over meanwhile is refused by the fence, as a late result is (2510).</summary>
    private async Task EndUnsolvedAsync(QueueJob job, Func<CancellationToken, Task<bool>> end, CancellationToken stop)
    {
        var (written, accepted) = await PersistAsync(job, end, stop);
        if (written && !accepted)
        {
            QueueLog.ResultRefused(log, job.Id, job.Claim);
        }
    }

    /// <summary>The search in this process (Isolation: InProcess): a native crash here ends the worker.</summary>
    private Ran InProcess(JobPlan plan, string folder, double? benchBudget, QueueProgress progress, CancellationToken stop)
    {
        var run = runner.Run(plan, progress.Report, stop);
        writer.Write(folder, run, clock.GetUtcNow());
        return new Solved(ResultPackage.From(run, folder, benchBudget));
    }

    /// <summary>The search in its own process (Isolation: Process, the default): its crash, kill or hang is this job's failure only.</summary>
    private Ran InChild(JobPlan plan, JobRequest request, string located, string scratch, string folder, double? benchBudget, QueueProgress progress, CancellationToken stop)
    {
        string package = Path.Combine(scratch, "package.json");
        var args = new List<string>(ChildSide.Arguments(Path.GetFullPath(located), folder, request, clock.GetUtcNow())) { "--package", package };
        if (benchBudget is { } budget)
        {
            args.AddRange(["--bench-budget", budget.ToString("R", System.Globalization.CultureInfo.InvariantCulture)]);
        }

        var outcome = child.Run(args, ChildRun.Deadline(plan.Seconds, options.HangGraceSeconds), TimeSpan.FromSeconds(options.ShutdownTimeoutSeconds), progress.Report, stop);
        return outcome is ChildOutcome.Completed ? new Solved(ResultPackage.Load(package, folder)) : new NotSolved(outcome);
    }

    private abstract record Ran;

    private sealed record Solved(ResultPackage Package) : Ran;

    private sealed record NotSolved(ChildOutcome Outcome) : Ran;

    /// <summary>
    /// Runs a database step until it succeeds, waiting with backoff while the database does not answer; once the worker
    /// is stopping, only until its shutdown timeout is nearly used up. Reached is false when it gave up.
    /// </summary>
    private async Task<(bool Reached, T? Value)> PersistAsync<T>(QueueJob job, Func<CancellationToken, Task<T>> step, CancellationToken stop)
    {
        var backoff = new Backoff(queue.RetryMaxSeconds);
        DateTimeOffset? deadline = null;
        while (true)
        {
            try
            {
                // The step itself is never cancelled by the stop request: a result is worth storing while stopping.
                return (true, await step(CancellationToken.None));
            }
            catch (Exception e) when (Backoff.IsTransient(e))
            {
                var wait = backoff.Fail();
                if (stop.IsCancellationRequested)
                {
                    deadline ??= clock.GetUtcNow() + TimeSpan.FromSeconds(Math.Max(1, options.ShutdownTimeoutSeconds - 2));
                    if (clock.GetUtcNow() + wait > deadline)
                    {
                        QueueLog.StoreAbandoned(log, job.Id);
                        return (false, default);
                    }
                }

                QueueLog.StoreRetry(log, job.Id, e.Message, wait.TotalSeconds);
                await Task.Delay(wait, clock, CancellationToken.None);
            }
        }
    }
}
