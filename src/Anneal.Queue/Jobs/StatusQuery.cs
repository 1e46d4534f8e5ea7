using System.Text.Json;
using Npgsql;

namespace Anneal.Queue.Jobs;

/// <summary>Reads the queue's state in one snapshot (a repeatable-read transaction), so the counts and the lists agree.</summary>
public static class StatusQuery
{
    internal static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static async Task<QueueStatus> ReadAsync(NpgsqlDataSource db, int listed, CancellationToken cancel)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(System.Data.IsolationLevel.RepeatableRead, cancel);
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        await using (var cmd = new NpgsqlCommand("SELECT state, count(*)::int FROM jobs GROUP BY state", conn, tx))
        await using (var r = await cmd.ExecuteReaderAsync(cancel))
        {
            while (await r.ReadAsync(cancel))
            {
                counts[r.GetString(0)] = r.GetInt32(1);
            }
        }

        var running = new List<RunningJob>();
        await using (var cmd = new NpgsqlCommand(
            """
            SELECT id, name, worker, attempt, claimed_at, extract(epoch FROM now() - claimed_at)::float8, lease_until, progress::text
            FROM jobs WHERE state = 'running' ORDER BY claimed_at, id
            """, conn, tx))
        await using (var r = await cmd.ExecuteReaderAsync(cancel))
        {
            while (await r.ReadAsync(cancel))
            {
                var progress = r.IsDBNull(7) ? [] : JsonSerializer.Deserialize<List<SolverProgress>>(r.GetString(7), Json) ?? [];
                running.Add(new RunningJob(r.GetInt64(0), r.GetString(1), r.GetString(2), r.GetInt32(3), r.GetFieldValue<DateTimeOffset>(4), r.GetDouble(5),
                    r.GetFieldValue<DateTimeOffset>(6), progress));
            }
        }

        var failed = new List<FailedJob>();
        await using (var cmd = new NpgsqlCommand(
            "SELECT id, name, attempt, finished_at, coalesce(error, '') FROM jobs WHERE state = 'failed' ORDER BY finished_at DESC NULLS LAST, id DESC LIMIT @n", conn, tx))
        {
            cmd.Parameters.AddWithValue("n", listed);
            await using var r = await cmd.ExecuteReaderAsync(cancel);
            while (await r.ReadAsync(cancel))
            {
                failed.Add(new FailedJob(r.GetInt64(0), r.GetString(1), r.GetInt32(2), r.IsDBNull(3) ? null : r.GetFieldValue<DateTimeOffset>(3), r.GetString(4)));
            }
        }

        var done = new List<DoneJob>();
        await using (var cmd = new NpgsqlCommand(
            """
            SELECT j.id, j.name, r.solver, r.objective, r.vehicles, r.feasible, r.interrupted, r.finished_at
            FROM jobs j JOIN results r ON r.job_id = j.id WHERE j.state = 'done' ORDER BY r.finished_at DESC, j.id DESC LIMIT @n
            """, conn, tx))
        {
            cmd.Parameters.AddWithValue("n", listed);
            await using var r = await cmd.ExecuteReaderAsync(cancel);
            while (await r.ReadAsync(cancel))
            {
                done.Add(new DoneJob(r.GetInt64(0), r.GetString(1), r.GetString(2), r.GetDouble(3), r.GetInt32(4), r.GetBoolean(5), r.GetBoolean(6), r.GetFieldValue<DateTimeOffset>(7)));
            }
        }

        await tx.CommitAsync(cancel);
        return new QueueStatus(Count("queued"), Count("running"), Count("done"), Count("failed"), running, failed, done);

        int Count(string state) => counts.TryGetValue(state, out int n) ? n : 0;
    }
}
