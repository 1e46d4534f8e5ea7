using Anneal.Core.Model;
using Anneal.Queue.Inputs;
using Anneal.Queue.Jobs;
using Npgsql;

namespace Anneal.Queue.Worker;

/// <summary>
/// Taking jobs and keeping them: a claim is `SELECT … FOR UPDATE SKIP LOCKED LIMIT 1` in the transaction that marks the
/// job running and raises its claim counter (the fencing token); a heartbeat renews the lease only while that token is
/// still the job's; any worker puts back jobs whose lease ran out. Times are the database's, so the machines' clocks
/// need not agree.
/// </summary>
public sealed class Claims(NpgsqlDataSource db, string workerId)
{
    /// <summary>The next queued job (highest priority, then oldest), now running under this worker; null when none is free.</summary>
    public async Task<QueueJob?> ClaimAsync(double leaseSeconds, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        long id;
        await using (var pick = new NpgsqlCommand("SELECT id FROM jobs WHERE state = 'queued' ORDER BY priority DESC, id FOR UPDATE SKIP LOCKED LIMIT 1", conn, tx))
        {
            if (await pick.ExecuteScalarAsync(cancel) is not long found)
            {
                await tx.RollbackAsync(cancel);
                return null;
            }

            id = found;
        }

        QueueJob job;
        await using (var mark = new NpgsqlCommand(
            """
            UPDATE jobs SET state = 'running', claim = claim + 1, worker = @worker, claimed_at = now(),
                            lease_until = now() + make_interval(secs => @lease), progress = NULL
            WHERE id = @id
            RETURNING name, kind, claim, attempt, solvers, time_seconds, iterations, objective, seed, experiment_id, claimed_at
            """, conn, tx))
        {
            mark.Parameters.AddWithValue("worker", workerId);
            mark.Parameters.AddWithValue("lease", leaseSeconds);
            mark.Parameters.AddWithValue("id", id);
            await using var r = await mark.ExecuteReaderAsync(cancel);
            await r.ReadAsync(cancel);
            var spec = new JobSpec
            {
                Solvers = r.IsDBNull(4) ? null : r.GetString(4),
                TimeSeconds = r.IsDBNull(5) ? null : r.GetDouble(5),
                Iterations = r.IsDBNull(6) ? null : r.GetInt64(6),
                Objective = !r.IsDBNull(7) && ObjectiveNames.TryParse(r.GetString(7), out var o) ? o : null,
                Seed = r.IsDBNull(8) ? null : r.GetInt32(8),
                ExperimentId = r.IsDBNull(9) ? null : r.GetInt64(9),
            };
            job = new QueueJob(id, r.GetString(0), r.GetString(1), r.GetInt64(2), r.GetInt32(3), spec, r.GetFieldValue<DateTimeOffset>(10));
        }

        await Event(conn, tx, job.Id, job.Claim, workerId, "claimed", null, cancel);
        await tx.CommitAsync(cancel);
        return job;
    }

    /// <summary>Renews the lease and stores the best so far; false when the claim is no longer the job's (the lease was lost).</summary>
    public async Task<bool> HeartbeatAsync(QueueJob job, double leaseSeconds, string? progressJson, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand(
            """
            UPDATE jobs SET lease_until = now() + make_interval(secs => @lease), progress = @progress::jsonb
            WHERE id = @id AND claim = @claim AND state = 'running'
            """);
        cmd.Parameters.AddWithValue("lease", leaseSeconds);
        cmd.Parameters.Add(Submitter.Nullable("progress", NpgsqlTypes.NpgsqlDbType.Text, progressJson));
        cmd.Parameters.AddWithValue("id", job.Id);
        cmd.Parameters.AddWithValue("claim", job.Claim);
        return await cmd.ExecuteNonQueryAsync(cancel) == 1;
    }

    /// <summary>A job whose lease ran out, as the sweep left it.</summary>
    /// <param name="State">"queued" (attempt + 1) or "failed" (its retries are spent).</param>
    public sealed record Expired(long Id, string Name, string DeadWorker, string State, int Attempt);

    /// <summary>Puts back every running job whose lease ran out (attempt + 1), or fails it once it has had MaxRetries + 1 attempts.</summary>
    public async Task<IReadOnlyList<Expired>> RequeueExpiredAsync(int maxRetries, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        var list = new List<Expired>();
        await using (var cmd = new NpgsqlCommand(
            """
            WITH expired AS (
                SELECT id, worker, claim, attempt, attempt > @max AS spent FROM jobs
                WHERE state = 'running' AND lease_until < now() FOR UPDATE SKIP LOCKED
            ), moved AS (
                UPDATE jobs j SET
                    state = CASE WHEN e.spent THEN 'failed' ELSE 'queued' END,
                    attempt = CASE WHEN e.spent THEN j.attempt ELSE j.attempt + 1 END,
                    error = CASE WHEN e.spent
                        THEN format('Given up after %s attempts: each time, the worker solving it stopped renewing its lease (the last one was %s). A worker that is killed or runs out of memory on this job every time points at the job''s size or at the machine; try it alone with `anneal solve`.', j.attempt, e.worker)
                        ELSE j.error END,
                    finished_at = CASE WHEN e.spent THEN now() ELSE NULL END,
                    worker = NULL, lease_until = NULL, progress = NULL
                FROM expired e WHERE j.id = e.id
                RETURNING j.id, j.name, e.worker, j.state, j.attempt, e.claim
            ), logged AS (
                INSERT INTO job_events (job_id, claim, worker, event, detail)
                SELECT id, claim, @me, CASE state WHEN 'failed' THEN 'failed' ELSE 'expired' END, 'lease of ' || worker || ' ran out' FROM moved
            )
            SELECT id, name, worker, state, attempt FROM moved ORDER BY id
            """, conn, tx))
        {
            cmd.Parameters.AddWithValue("max", maxRetries);
            cmd.Parameters.AddWithValue("me", workerId);
            await using var r = await cmd.ExecuteReaderAsync(cancel);
            while (await r.ReadAsync(cancel))
            {
                list.Add(new Expired(r.GetInt64(0), r.GetString(1), r.GetString(2), r.GetString(3), r.GetInt32(4)));
            }
        }

        if (list.Exists(e => e.State == "queued"))
        {
            await Notify(conn, tx, cancel);
        }

        await tx.CommitAsync(cancel);
        return list;
    }

    /// <summary>True when a job waits to be claimed (for --once: stop when there is none).</summary>
    public async Task<bool> AnyQueuedAsync(CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT EXISTS (SELECT 1 FROM jobs WHERE state = 'queued')");
        return (bool)(await cmd.ExecuteScalarAsync(cancel))!;
    }

    public async Task<IReadOnlyList<StoredFile>> InputsAsync(long jobId, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT path, content FROM job_inputs WHERE job_id = @id ORDER BY path");
        cmd.Parameters.AddWithValue("id", jobId);
        var files = new List<StoredFile>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            files.Add(new StoredFile(r.GetString(0), r.GetFieldValue<byte[]>(1)));
        }

        return files;
    }

    internal static async Task Event(NpgsqlConnection conn, NpgsqlTransaction tx, long jobId, long claim, string worker, string name, string? detail, CancellationToken cancel)
    {
        await using var cmd = new NpgsqlCommand("INSERT INTO job_events (job_id, claim, worker, event, detail) VALUES (@id, @claim, @worker, @event, @detail)", conn, tx);
        cmd.Parameters.AddWithValue("id", jobId);
        cmd.Parameters.AddWithValue("claim", claim);
        cmd.Parameters.AddWithValue("worker", worker);
        cmd.Parameters.AddWithValue("event", name);
        cmd.Parameters.Add(Submitter.Nullable("detail", NpgsqlTypes.NpgsqlDbType.Text, detail));
        await cmd.ExecuteNonQueryAsync(cancel);
    }

    internal static async Task Notify(NpgsqlConnection conn, NpgsqlTransaction tx, CancellationToken cancel)
    {
        await using var cmd = new NpgsqlCommand($"NOTIFY {Submitter.Channel}", conn, tx);
        await cmd.ExecuteNonQueryAsync(cancel);
    }
}
