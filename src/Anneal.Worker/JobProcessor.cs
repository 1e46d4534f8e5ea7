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
            log.LogWarning("Job {JobId} has invalid input ({Problems}; the first: {First}); moved to {Folder}", job.Id, Count(lines.Count), lines.Count > 0 ? lines[0] : "none named", folder);
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

        log.LogInformation("Job {JobId} started (attempt {Attempt}): {Stops} stops, solvers {Solvers}, up to {Budget:0.#} s{Where}",
            job.Id, job.Attempt, plan.Instance.StopCount, string.Join(",", plan.SolverNames), plan.Seconds,
            options.Isolation == SolverIsolation.Process ? " in its own process" : string.Empty);
        foreach (var note in plan.Notes)
        {
            log.LogInformation("Job {JobId}: {Note}", job.Id, note);
        }

        if (Oversubscription.Warning(plan.Solvers.Count, plan.Options.Threads, options.ConcurrentJobs, Environment.ProcessorCount) is { } crowded)
        {
            log.LogWarning("Job {JobId}: {Warning}", job.Id, crowded);
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

        log.LogInformation("Job {JobId} {Outcome}: {Solver} objective {BestObjective:F2} ({Feasibility}), {Vehicles} vehicles, after {Elapsed:F1} s; written to {Folder}",
            job.Id, result switch { JobResult.Solved => "solved", JobResult.Interrupted => "interrupted (kept as its result)", _ => "interrupted (plan written, job requeued)" },
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
        log.LogError("Job {JobId}: the outbox has no space left ({Reason}); its plan was not published, and it is back in the inbox as {Entry} with no attempt counted",
            job.Id, reason, Path.GetFileName(back));
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
            log.LogWarning("Job {JobId}: the solved input could not be removed from {Path}: {Reason}", job.Id, job.Path, e.Message);
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
        log.LogError("Job {JobId} failed in its solver process: {Reason}; moved to {Folder}", job.Id, reason, folder);
        return (JobResult.Failed, folder);
    }

    /// <summary>An unexpected error: the job goes back with one more retry counted, or to failed/ when they are spent.</summary>
    private (JobResult, string) GiveBack(ClaimedJob job, string reason)
    {
        if (!Entries.Exists(job.Path))
        {
            // It already left this worker's folder (the error came after); nothing to hand on.
            log.LogError("Job {JobId} hit an error after its input was handed on: {Reason}", job.Id, reason);
            return (JobResult.Failed, job.Path);
        }

        if (job.Entry.Retries >= options.MaxRetries)
        {
            string folder = FailedJobs.Move(folders, workerId, job, $"Job '{job.Id}' was given up after {job.Attempt} attempts.", [$"The last attempt failed with: {reason}"]);
            log.LogError("Job {JobId} failed for good after {Attempts} attempts: {Reason}; moved to {Folder}", job.Id, job.Attempt, reason, folder);
            return (JobResult.Failed, folder);
        }

        string back = claimer.Return(job.Path, job.Entry.WithRetries(job.Entry.Retries + 1));
        log.LogError("Job {JobId} failed on attempt {Attempt}: {Reason}; back in the inbox as {Entry}", job.Id, job.Attempt, reason, Path.GetFileName(back));
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
