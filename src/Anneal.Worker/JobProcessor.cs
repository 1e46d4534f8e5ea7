using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Jobs;
using Anneal.Core.Solving;
using Anneal.Worker.Isolation;
using Anneal.Worker.Untrusted;
using Microsoft.Extensions.Logging;

namespace Anneal.Worker;

/// <summary>Solves one claimed job and leaves it in exactly one place: the outbox, failed/, or back in the inbox.</summary>
public sealed class JobProcessor(
    WorkerOptions options, WorkerFolders folders, string workerId, JobClaimer claimer, JobRunner runner, RunWriter writer, ChildRun child, ILogger log, TimeProvider clock)
{
    public (JobResult Result, string Where) Process(ClaimedJob job, JobProgress progress, CancellationToken stop)
    {
        try
        {
            return Solve(job, progress, stop);
        }
        catch (InputException e)
        {
            var lines = new List<string>();
            foreach (var problem in e.Problems)
            {
                lines.Add(Relative(problem, job).ToString());
            }

            string folder = FailedJobs.Move(folders, workerId, job, $"Job '{job.Id}' could not be read: {Count(lines.Count)} in the input.", lines);
            WorkerLog.JobInvalid(log, job.Id, Count(lines.Count), lines.Count > 0 ? lines[0] : "none named", folder);
            return (JobResult.Failed, folder);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            return GiveBack(job, e is OutputException ? e.Message : $"{e.GetType().Name}: {e.Message}");
        }
        finally
        {
            Entries.TryDelete(JobInput.ScratchFor(job));
        }
    }

    private (JobResult, string) Solve(ClaimedJob job, JobProgress progress, CancellationToken stop)
    {
        string located = JobInput.Locate(job, new UnpackLimits(options.MaxZipBytes, options.MaxZipRatio));
        var input = InputLoader.Load(located);
        var request = new JobRequest
        {
            Solvers = string.IsNullOrWhiteSpace(options.Solvers) ? null : options.Solvers,
            DefaultTimeSeconds = options.TimeSeconds,
            Threads = options.ThreadsPerJob,
            WholeRun = true,
            Spent = clock.GetUtcNow() - job.ClaimedAt,
        };
        JobPlan plan;
        try
        {
            plan = runner.Prepare(input, request);
        }
        catch (UnknownSolverException e)
        {
            throw new InputException(new InputProblem("settings.json", null, "solvers", e.Name, e.Message, "name only known solvers in \"solvers\""));
        }

        if (stop.IsCancellationRequested)
        {
            return (JobResult.Requeued, claimer.Return(job.Path, job.Entry));
        }

        if (log.IsEnabled(LogLevel.Information))
        {
            string solvers = string.Join(",", plan.SolverNames);
            WorkerLog.JobStarted(log, job.Id, job.Attempt, plan.Instance.StopCount, solvers, plan.Seconds,
                options.Isolation == SolverIsolation.Process ? " in its own process" : string.Empty);
        }

        foreach (var note in plan.Notes)
        {
            WorkerLog.JobNote(log, job.Id, note);
        }

        if (Oversubscription.Warning(plan.Solvers.Count, plan.Options.Threads, options.ConcurrentJobs, Environment.ProcessorCount) is { } crowded)
        {
            WorkerLog.JobCrowded(log, job.Id, crowded);
        }

        string? partial = null;
        string published;
        ChildResult best;
        bool requeue;
        DateTimeOffset now;
        try
        {
            partial = Publisher.NewPartial(folders.Outbox, workerId, job.Id);
            var outcome = options.Isolation == SolverIsolation.Process
                ? InChild(job, located, partial, request, plan, progress, stop)
                : InProcess(plan, partial, progress, stop);
            switch (outcome)
            {
                case ChildOutcome.Failed failed:
                    Entries.TryDelete(partial);
                    return SolverFailed(job, failed.Reason);
                case ChildOutcome.NoSpace full:
                    return NoSpace(job, partial, full.Reason);
                case ChildOutcome.Stopped:
                    Entries.TryDelete(partial);
                    return (JobResult.Requeued, claimer.Return(job.Path, job.Entry));
            }

            best = ((ChildOutcome.Completed)outcome).Result;
            requeue = best.Interrupted && options.OnShutdown == ShutdownChoice.Requeue;
            now = clock.GetUtcNow();
            new JobRecord(job.Id, job.Entry.Name, workerId, job.Attempt, job.ClaimedAt, now, best.Interrupted, Final: !requeue).Write(partial);
            published = Publisher.Publish(partial, folders.Outbox, job.Id, workerId);
        }
        catch (Exception e) when (DiskFull.Is(e))
        {
            return NoSpace(job, partial, e.Message);
        }

        // Only now is the input let go: a crash before this line leaves it in working/ for recovery, which sees job.json.
        JobResult result;
        if (requeue)
        {
            claimer.Return(job.Path, job.Entry);
            result = JobResult.Requeued;
        }
        else
        {
            DropInput(job);
            result = best.Interrupted ? JobResult.Interrupted : JobResult.Solved;
        }

        WorkerLog.JobWritten(log, job.Id, result switch { JobResult.Solved => "solved", JobResult.Interrupted => "interrupted (kept as its result)", _ => "interrupted (plan written, job requeued)" },
            best.Solver, best.Objective, best.Feasible ? "feasible" : "infeasible", best.Vehicles, (now - job.ClaimedAt).TotalSeconds, published);
        return (result, published);
    }

    /// <summary>The search in this process (Isolation: InProcess): a native crash here ends the worker.</summary>
    private ChildOutcome InProcess(JobPlan plan, string partial, JobProgress progress, CancellationToken stop)
    {
        var run = runner.Run(plan, progress.Report, stop);
        writer.Write(partial, run, clock.GetUtcNow());
        var best = run.Outcome.Best;
        return new ChildOutcome.Completed(new ChildResult(run.Interrupted, best.Result.Solver, best.Evaluation.Objective, best.Evaluation.Feasible, best.Evaluation.VehiclesUsed));
    }

    /// <summary>The search in its own process (Isolation: Process, the default): its crash, kill or hang is this job's failure only.</summary>
    private ChildOutcome InChild(ClaimedJob job, string located, string partial, JobRequest request, JobPlan plan, JobProgress progress, CancellationToken stop)
    {
        return child.Run(ChildSide.Arguments(Path.GetFullPath(located), partial, request, job.ClaimedAt), ChildRun.Deadline(plan.Seconds, options.HangGraceSeconds),
            TimeSpan.FromSeconds(options.ShutdownTimeoutSeconds), progress.Report, stop);
    }

    /// <summary>The outbox is full: nothing half-written stays, and the job goes back as it was, with no attempt counted.</summary>
    private (JobResult, string) NoSpace(ClaimedJob job, string? partial, string reason)
    {
        if (partial is not null)
        {
            Entries.TryDelete(partial);
        }

        string back = claimer.Return(job.Path, job.Entry);
        WorkerLog.JobNoSpace(log, job.Id, reason, Path.GetFileName(back));
        return (JobResult.NoSpace, back);
    }

    private void DropInput(ClaimedJob job)
    {
        try
        {
            Entries.Delete(job.Path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Published already; recovery will find job.json and only remove the input then.
            WorkerLog.InputNotRemoved(log, job.Id, job.Path, e.Message);
        }
    }

    /// <summary>
    /// The solver process crashed, was killed or hung: the same input would do it again, so the job goes to failed/ at
    /// once with the reason instead of costing its retries (and their budgets).
    /// </summary>
    private (JobResult, string) SolverFailed(ClaimedJob job, string reason)
    {
        string folder = FailedJobs.Move(folders, workerId, job, $"Job '{job.Id}' could not be solved: {reason}.",
            ["The worker went on with the next job. If the input is sound, tell the maintainers what the job holds; the other solvers may still solve it (\"solvers\" in settings.json)."]);
        WorkerLog.SolverProcessFailed(log, job.Id, reason, folder);
        return (JobResult.Failed, folder);
    }

    /// <summary>An unexpected error: the job goes back with one more retry counted, or to failed/ when they are spent.</summary>
    private (JobResult, string) GiveBack(ClaimedJob job, string reason)
    {
        if (!Entries.Exists(job.Path))
        {
            // It already left this worker's folder (the error came after); nothing to hand on.
            WorkerLog.ErrorAfterHandOn(log, job.Id, reason);
            return (JobResult.Failed, job.Path);
        }

        if (job.Entry.Retries >= options.MaxRetries)
        {
            string folder = FailedJobs.Move(folders, workerId, job, $"Job '{job.Id}' was given up after {job.Attempt} attempts.", [$"The last attempt failed with: {reason}"]);
            WorkerLog.JobGivenUp(log, job.Id, job.Attempt, reason, folder);
            return (JobResult.Failed, folder);
        }

        string back = claimer.Return(job.Path, job.Entry.WithRetries(job.Entry.Retries + 1));
        WorkerLog.JobRetried(log, job.Id, job.Attempt, reason, Path.GetFileName(back));
        return (JobResult.Retry, back);
    }

    /// <summary>Problems in a benchmark file name it as the user dropped it, not by its path inside working/.</summary>
    private static InputProblem Relative(InputProblem problem, ClaimedJob job)
    {
        string folder = Path.GetDirectoryName(job.Path)! + Path.DirectorySeparatorChar;
        if (!problem.File.StartsWith(folder, StringComparison.Ordinal))
        {
            return problem;
        }

        string rest = problem.File[folder.Length..];
        if (rest.StartsWith(".unzipped-", StringComparison.Ordinal))
        {
            int slash = rest.IndexOf(Path.DirectorySeparatorChar);
            rest = job.Entry.Name + (slash < 0 ? string.Empty : rest[slash..]);
        }

        return problem with { File = rest };
    }

    private static string Count(int n) => n == 1 ? "1 problem" : $"{n} problems";
}
