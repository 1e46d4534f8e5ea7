using Anneal.Queue.Inputs;
using Npgsql;

namespace Anneal.Queue.Jobs;

/// <summary>A job as `fetch` and the status page see it: its state and whether a result is stored.</summary>
/// <param name="Interrupted">The stored result was cut short (a worker stopping); for a queued job it is replaced by the next full run.</param>
public sealed record JobOverview(long Id, string Name, string State, int Attempt, bool HasResult, bool Interrupted, string? Error, DateTimeOffset? FinishedAt);

/// <summary>One step of a job's history: claimed, done, requeued, expired, refused, failed, retry.</summary>
public sealed record JobEvent(DateTimeOffset At, long Claim, string? Worker, string Event, string? Detail);

/// <summary>Which jobs `fetch` wants: by id, all of them, or those finished since a moment.</summary>
public sealed record JobSelection(IReadOnlyList<long>? Ids, DateTimeOffset? Since)
{
    public static JobSelection All { get; } = new(null, null);
}

/// <summary>Reads stored results back: which jobs have one, and their files.</summary>
public static class ResultReader
{
    private const string Columns =
        "SELECT j.id, j.name, j.state, j.attempt, r.job_id IS NOT NULL, coalesce(r.interrupted, false), j.error, coalesce(r.finished_at, j.finished_at) FROM jobs j LEFT JOIN results r ON r.job_id = j.id ";

    /// <summary>By id: every named job that exists; otherwise every job with a result or a failure (finished since <see cref="JobSelection.Since"/>).</summary>
    public static async Task<IReadOnlyList<JobOverview>> FindAsync(NpgsqlDataSource db, JobSelection which, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand();
        if (which.Ids is { } ids)
        {
            cmd.CommandText = Columns + "WHERE j.id = ANY(@ids) ORDER BY j.id";
            cmd.Parameters.AddWithValue("ids", ids.ToArray());
        }
        else
        {
            cmd.CommandText = Columns + "WHERE (r.job_id IS NOT NULL OR j.state = 'failed') AND (@since::timestamptz IS NULL OR coalesce(r.finished_at, j.finished_at) >= @since) ORDER BY j.id";
            cmd.Parameters.Add(Submitter.Nullable("since", NpgsqlTypes.NpgsqlDbType.TimestampTz, which.Since?.ToUniversalTime()));
        }

        var list = new List<JobOverview>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            list.Add(new JobOverview(r.GetInt64(0), r.GetString(1), r.GetString(2), r.GetInt32(3), r.GetBoolean(4), r.GetBoolean(5),
                r.IsDBNull(6) ? null : r.GetString(6), r.IsDBNull(7) ? null : r.GetFieldValue<DateTimeOffset>(7)));
        }

        return list;
    }

    public static async Task<JobOverview?> FindAsync(NpgsqlDataSource db, long id, CancellationToken cancel)
    {
        var found = await FindAsync(db, new JobSelection([id], null), cancel);
        return found.Count == 0 ? null : found[0];
    }

    public static async Task<IReadOnlyList<JobEvent>> EventsAsync(NpgsqlDataSource db, long id, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT at, claim, worker, event, detail FROM job_events WHERE job_id = @id ORDER BY id");
        cmd.Parameters.AddWithValue("id", id);
        var list = new List<JobEvent>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            list.Add(new JobEvent(r.GetFieldValue<DateTimeOffset>(0), r.GetInt64(1), r.IsDBNull(2) ? null : r.GetString(2), r.GetString(3), r.IsDBNull(4) ? null : r.GetString(4)));
        }

        return list;
    }

    /// <summary>The names and media types of a job's result files, without their content.</summary>
    public static async Task<IReadOnlyList<(string Name, string MediaType, long Bytes)>> ListAsync(NpgsqlDataSource db, long id, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT name, media_type, octet_length(content) FROM result_files WHERE job_id = @id ORDER BY name");
        cmd.Parameters.AddWithValue("id", id);
        var list = new List<(string, string, long)>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            list.Add((r.GetString(0), r.GetString(1), r.GetInt32(2)));
        }

        return list;
    }

    public static async Task<IReadOnlyList<StoredFile>> FilesAsync(NpgsqlDataSource db, long id, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT name, content FROM result_files WHERE job_id = @id ORDER BY name");
        cmd.Parameters.AddWithValue("id", id);
        var list = new List<StoredFile>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            list.Add(new StoredFile(r.GetString(0), r.GetFieldValue<byte[]>(1)));
        }

        return list;
    }

    /// <summary>One result file with its media type; null when the job has no such file.</summary>
    public static async Task<(byte[] Content, string MediaType)?> FileAsync(NpgsqlDataSource db, long id, string name, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT content, media_type FROM result_files WHERE job_id = @id AND name = @name");
        cmd.Parameters.AddWithValue("id", id);
        cmd.Parameters.AddWithValue("name", name);
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        return await r.ReadAsync(cancel) ? (r.GetFieldValue<byte[]>(0), r.GetString(1)) : null;
    }
}
