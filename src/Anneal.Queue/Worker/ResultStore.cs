using Anneal.Queue.Jobs;
using Npgsql;

namespace Anneal.Queue.Worker;

/// <summary>How a claim ends.</summary>
public enum ClaimEnd
{
    /// <summary>The result is the job's; it is done.</summary>
    Done,

    /// <summary>The (interrupted) result is stored and the job is queued again, with no retry counted: OnShutdown = Requeue.</summary>
    Requeued,
}

/// <summary>
/// Ends claims. Every write first locks the job's row and checks that the claim is still the job's and the job still
/// running (the fencing token): a worker whose lease ran out and whose job was claimed again is refused, and nothing of
/// its result is written. A result (its row, files, plan rows, benchmark row) goes in the same transaction as the
/// job's change of state, so a job is done with all of its result or not done.
/// </summary>
public sealed class ResultStore(NpgsqlDataSource db, string workerId)
{
    /// <returns>False when the claim was refused (stale); nothing was written then.</returns>
    public async Task<bool> CompleteAsync(QueueJob job, ResultPackage result, ClaimEnd end, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        if (!await HoldsAsync(conn, tx, job, cancel))
        {
            return false;
        }

        await using (var clear = new NpgsqlCommand(
            "DELETE FROM results WHERE job_id = @id; DELETE FROM result_files WHERE job_id = @id; DELETE FROM plan_rows WHERE job_id = @id; DELETE FROM bench_results WHERE job_id = @id",
            conn, tx))
        {
            clear.Parameters.AddWithValue("id", job.Id);
            await clear.ExecuteNonQueryAsync(cancel);
        }

        await using (var row = new NpgsqlCommand(
            """
            INSERT INTO results (job_id, claim, attempt, worker, instance, solver, objective_kind, objective, distance, duration, vehicles, feasible,
                                 unserved, interrupted, seconds, summary)
            VALUES (@id, @claim, @attempt, @worker, @instance, @solver, @kind, @objective, @distance, @duration, @vehicles, @feasible,
                    @unserved, @interrupted, @seconds, @summary::jsonb)
            """, conn, tx))
        {
            var p = row.Parameters;
            p.AddWithValue("id", job.Id);
            p.AddWithValue("claim", job.Claim);
            p.AddWithValue("attempt", job.Attempt);
            p.AddWithValue("worker", workerId);
            p.AddWithValue("instance", result.Instance);
            p.AddWithValue("solver", result.Solver);
            p.AddWithValue("kind", result.ObjectiveKind);
            p.AddWithValue("objective", result.Objective);
            p.AddWithValue("distance", result.Distance);
            p.AddWithValue("duration", result.Duration);
            p.AddWithValue("vehicles", result.Vehicles);
            p.AddWithValue("feasible", result.Feasible);
            p.AddWithValue("unserved", result.Unserved);
            p.AddWithValue("interrupted", result.Interrupted);
            p.AddWithValue("seconds", result.Seconds);
            p.AddWithValue("summary", result.SummaryJson);
            await row.ExecuteNonQueryAsync(cancel);
        }

        await using (var batch = new NpgsqlBatch(conn, tx))
        {
            foreach (var file in result.Files)
            {
                var put = new NpgsqlBatchCommand("INSERT INTO result_files (job_id, name, media_type, content) VALUES (@id, @name, @type, @content)");
                put.Parameters.AddWithValue("id", job.Id);
                put.Parameters.AddWithValue("name", file.Path);
                put.Parameters.AddWithValue("type", ResultPackage.MediaType(file.Path));
                put.Parameters.AddWithValue("content", file.Content);
                batch.BatchCommands.Add(put);
            }

            if (batch.BatchCommands.Count > 0)
            {
                await batch.ExecuteNonQueryAsync(cancel);
            }
        }

        await InsertPlanAsync(conn, tx, job.Id, result.Plan, cancel);
        if (result.Bench is { } bench && job.Spec.ExperimentId is { } experiment)
        {
            await InsertBenchAsync(conn, tx, job.Id, experiment, result, bench, cancel);
        }

        string state = end == ClaimEnd.Done ? "done" : "queued";
        await EndAsync(conn, tx, job, state, null, keepAttempt: true, cancel);
        await Claims.Event(conn, tx, job.Id, job.Claim, workerId, end == ClaimEnd.Done ? "done" : "requeued", result.Interrupted ? "interrupted" : null, cancel);
        if (end == ClaimEnd.Requeued)
        {
            await Claims.Notify(conn, tx, cancel);
        }

        await tx.CommitAsync(cancel);
        return true;
    }

    /// <summary>Marks the job failed with <paramref name="reason"/> (bad input, or its retries spent).</summary>
    /// <returns>False when the claim was refused (stale).</returns>
    public async Task<bool> FailAsync(QueueJob job, string reason, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        if (!await HoldsAsync(conn, tx, job, cancel))
        {
            return false;
        }

        await EndAsync(conn, tx, job, "failed", reason, keepAttempt: true, cancel);
        await Claims.Event(conn, tx, job.Id, job.Claim, workerId, "failed", reason, cancel);
        await tx.CommitAsync(cancel);
        return true;
    }

    /// <summary>Queues the job again: with one more attempt counted after an unexpected error, or as it was when the worker stops before solving it.</summary>
    /// <returns>False when the claim was refused (stale).</returns>
    public async Task<bool> RetryAsync(QueueJob job, string? reason, bool countAttempt, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        if (!await HoldsAsync(conn, tx, job, cancel))
        {
            return false;
        }

        await EndAsync(conn, tx, job, "queued", reason, keepAttempt: !countAttempt, cancel);
        await Claims.Event(conn, tx, job.Id, job.Claim, workerId, countAttempt ? "retry" : "requeued", reason, cancel);
        await Claims.Notify(conn, tx, cancel);
        await tx.CommitAsync(cancel);
        return true;
    }

    /// <summary>The fence: locks the job's row; true only while this claim is the job's and it is running. A refusal is recorded and committed.</summary>
    private async Task<bool> HoldsAsync(NpgsqlConnection conn, NpgsqlTransaction tx, QueueJob job, CancellationToken cancel)
    {
        await using var check = new NpgsqlCommand("SELECT claim = @claim AND state = 'running' FROM jobs WHERE id = @id FOR UPDATE", conn, tx);
        check.Parameters.AddWithValue("claim", job.Claim);
        check.Parameters.AddWithValue("id", job.Id);
        if (await check.ExecuteScalarAsync(cancel) is true)
        {
            return true;
        }

        await Claims.Event(conn, tx, job.Id, job.Claim, workerId, "refused", "the claim is no longer the job's", cancel);
        await tx.CommitAsync(cancel);
        return false;
    }

    private static async Task EndAsync(NpgsqlConnection conn, NpgsqlTransaction tx, QueueJob job, string state, string? error, bool keepAttempt, CancellationToken cancel)
    {
        await using var end = new NpgsqlCommand(
            """
            UPDATE jobs SET state = @state, error = @error, attempt = attempt + @more,
                            finished_at = CASE WHEN @state IN ('done', 'failed') THEN now() ELSE NULL END,
                            worker = CASE WHEN @state = 'queued' THEN NULL ELSE worker END, lease_until = NULL, progress = NULL
            WHERE id = @id
            """, conn, tx);
        end.Parameters.AddWithValue("state", state);
        end.Parameters.Add(Submitter.Nullable("error", NpgsqlTypes.NpgsqlDbType.Text, error));
        end.Parameters.AddWithValue("more", keepAttempt ? 0 : 1);
        end.Parameters.AddWithValue("id", job.Id);
        await end.ExecuteNonQueryAsync(cancel);
    }

    private static async Task InsertPlanAsync(NpgsqlConnection conn, NpgsqlTransaction tx, long id, IReadOnlyList<PlanRow> plan, CancellationToken cancel)
    {
        if (plan.Count == 0)
        {
            return;
        }

        await using var copy = await conn.BeginBinaryImportAsync("COPY plan_rows (job_id, vehicle, sequence, stop, arrival, start, departure, wait, late) FROM STDIN (FORMAT BINARY)", cancel);
        foreach (var r in plan)
        {
            await copy.StartRowAsync(cancel);
            await copy.WriteAsync(id, NpgsqlTypes.NpgsqlDbType.Bigint, cancel);
            await copy.WriteAsync(r.Vehicle, NpgsqlTypes.NpgsqlDbType.Text, cancel);
            await copy.WriteAsync(r.Sequence, NpgsqlTypes.NpgsqlDbType.Integer, cancel);
            await copy.WriteAsync(r.Stop, NpgsqlTypes.NpgsqlDbType.Text, cancel);
            await copy.WriteAsync(r.Arrival, NpgsqlTypes.NpgsqlDbType.Double, cancel);
            await copy.WriteAsync(r.Start, NpgsqlTypes.NpgsqlDbType.Double, cancel);
            await copy.WriteAsync(r.Departure, NpgsqlTypes.NpgsqlDbType.Double, cancel);
            await copy.WriteAsync(r.Wait, NpgsqlTypes.NpgsqlDbType.Double, cancel);
            await copy.WriteAsync(r.Late, NpgsqlTypes.NpgsqlDbType.Double, cancel);
        }

        await copy.CompleteAsync(cancel);
    }

    private static async Task InsertBenchAsync(NpgsqlConnection conn, NpgsqlTransaction tx, long id, long experiment, ResultPackage result, BenchRun b, CancellationToken cancel)
    {
        await using var cmd = new NpgsqlCommand(
            """
            INSERT INTO bench_results (job_id, experiment_id, instance, solver, seed, budget_s, objective, objective_value, vehicles, distance, feasible,
                                       has_plan, seconds_to_best, seconds, lower_bound, bound_only)
            VALUES (@id, @experiment, @instance, @solver, @seed, @budget, @objective, @value, @vehicles, @distance, @feasible, @plan, @best, @seconds,
                    @bound, @boundOnly)
            """, conn, tx);
        var p = cmd.Parameters;
        p.AddWithValue("id", id);
        p.AddWithValue("experiment", experiment);
        p.AddWithValue("instance", result.Instance);
        p.AddWithValue("solver", b.Solver);
        p.AddWithValue("seed", b.Seed);
        p.AddWithValue("budget", b.BudgetSeconds);
        p.AddWithValue("objective", result.ObjectiveKind);
        p.AddWithValue("value", b.ObjectiveValue);
        p.AddWithValue("vehicles", b.Vehicles);
        p.AddWithValue("distance", b.Distance);
        p.AddWithValue("feasible", b.Feasible);
        p.AddWithValue("plan", b.HasRoutes);
        p.AddWithValue("best", b.SecondsToBest);
        p.AddWithValue("seconds", b.Seconds);
        p.Add(Submitter.Nullable("bound", NpgsqlTypes.NpgsqlDbType.Double, b.LowerBound is { } bound && double.IsFinite(bound) ? bound : null));
        p.AddWithValue("boundOnly", b.BoundOnly);
        await cmd.ExecuteNonQueryAsync(cancel);
    }
}
