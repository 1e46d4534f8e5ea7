using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Jobs;
using Anneal.Queue.Inputs;
using Npgsql;
using NpgsqlTypes;

namespace Anneal.Queue.Jobs;

/// <summary>
/// Stores jobs in the queue: each input is packed, laid out again and read back exactly as a worker will read it, and
/// only when every job reads cleanly are they all inserted, in one transaction that wakes idle workers at commit.
/// </summary>
public sealed class Submitter(NpgsqlDataSource db, JobRunner runner)
{
    public const string Channel = "anneal_jobs";

    /// <summary>A job ready to store: its input read and checked.</summary>
    public sealed record Packed(string Name, IInputKind Kind, IReadOnlyList<StoredFile> Files, JobSpec Spec);

    /// <summary>Packs and checks one input as the worker will run it (solvers known, settings valid).</summary>
    /// <exception cref="InputException">with the problems `anneal check` reports for it.</exception>
    /// <exception cref="Core.Solving.UnknownSolverException">when the spec or the job's settings name an unknown solver.</exception>
    public Packed Pack(string path, JobSpec spec)
    {
        var kind = InputKinds.For(path);
        var files = kind.Pack(path);
        string name = InputKinds.JobName(path);
        string scratch = Directory.CreateTempSubdirectory("anneal-submit-").FullName;
        try
        {
            var input = StoredInput.Load(kind, name, files, scratch, Path.GetDirectoryName(path) ?? string.Empty);
            runner.Prepare(input, Request(spec, 30, 1));
        }
        finally
        {
            Directory.Delete(scratch, recursive: true);
        }

        return new Packed(name, kind, files, spec);
    }

    /// <returns>The new jobs' ids, in the order given.</returns>
    public async Task<IReadOnlyList<long>> InsertAsync(IReadOnlyList<Packed> jobs, CancellationToken cancel)
    {
        string by = $"{Environment.UserName}@{Environment.MachineName}";
        var ids = new List<long>(jobs.Count);
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        foreach (var job in jobs)
        {
            await using var insert = new NpgsqlCommand(
                """
                INSERT INTO jobs (name, kind, priority, solvers, time_seconds, iterations, objective, seed, experiment_id, label, submitted_by)
                VALUES (@name, @kind, @priority, @solvers, @time, @iterations, @objective, @seed, @experiment, @label, @by)
                RETURNING id
                """, conn, tx);
            var s = job.Spec;
            insert.Parameters.AddWithValue("name", job.Name);
            insert.Parameters.AddWithValue("kind", job.Kind.Name);
            insert.Parameters.AddWithValue("priority", s.Priority);
            insert.Parameters.Add(Nullable("solvers", NpgsqlDbType.Text, s.Solvers));
            insert.Parameters.Add(Nullable("time", NpgsqlDbType.Double, s.TimeSeconds));
            insert.Parameters.Add(Nullable("iterations", NpgsqlDbType.Bigint, s.Iterations));
            insert.Parameters.Add(Nullable("objective", NpgsqlDbType.Text, s.Objective?.ToText()));
            insert.Parameters.Add(Nullable("seed", NpgsqlDbType.Integer, s.Seed));
            insert.Parameters.Add(Nullable("experiment", NpgsqlDbType.Bigint, s.ExperimentId));
            insert.Parameters.Add(Nullable("label", NpgsqlDbType.Text, s.Label));
            insert.Parameters.AddWithValue("by", by);
            long id = (long)(await insert.ExecuteScalarAsync(cancel))!;
            ids.Add(id);

            await using var batch = new NpgsqlBatch(conn, tx);
            foreach (var file in job.Files)
            {
                var put = new NpgsqlBatchCommand("INSERT INTO job_inputs (job_id, path, content) VALUES (@id, @path, @content)");
                put.Parameters.AddWithValue("id", id);
                put.Parameters.AddWithValue("path", file.Path);
                put.Parameters.AddWithValue("content", file.Content);
                batch.BatchCommands.Add(put);
            }

            if (batch.BatchCommands.Count > 0)
            {
                await batch.ExecuteNonQueryAsync(cancel);
            }
        }

        await using (var notify = new NpgsqlCommand($"NOTIFY {Channel}", conn, tx))
        {
            await notify.ExecuteNonQueryAsync(cancel);
        }

        await tx.CommitAsync(cancel);
        return ids;
    }

    /// <summary>The job runner's request for a stored job: its spec over the worker's defaults.</summary>
    public static JobRequest Request(JobSpec spec, double defaultSeconds, int threads, string? workerSolvers = null) => new()
    {
        Solvers = spec.Solvers ?? (string.IsNullOrWhiteSpace(workerSolvers) ? null : workerSolvers),
        TimeSeconds = spec.TimeSeconds,
        DefaultTimeSeconds = defaultSeconds,
        Iterations = spec.Iterations,
        Objective = spec.Objective,
        Seed = spec.Seed,
        Threads = threads,
    };

    internal static NpgsqlParameter Nullable(string name, NpgsqlDbType type, object? value) =>
        new(name, type) { Value = value ?? DBNull.Value };
}
