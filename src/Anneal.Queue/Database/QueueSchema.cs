using Npgsql;

namespace Anneal.Queue.Database;

/// <summary>
/// The tables of the queue and result store, and the version they are at. `anneal queue init` creates or migrates them
/// (idempotent: every step is guarded, and all of it runs in one transaction under an advisory lock, so two inits at
/// once cannot interleave); every other command checks the version first and refuses a database of another one.
/// </summary>
public static class QueueSchema
{
    /// <summary>The version this build reads and writes. A migration adds a step to <see cref="Steps"/> and raises it.</summary>
    public const int Version = 2;

    /// <summary>Any constant: the advisory lock that serialises concurrent inits.</summary>
    private const long InitLock = 0x616E6E65616C;

    /// <summary>Step k brings a database at version k - 1 to version k.</summary>
    private static readonly string[] Steps =
    [
        """
        CREATE TABLE anneal_schema (
            version     integer     NOT NULL,
            migrated_at timestamptz NOT NULL DEFAULT now()
        );

        -- One row per submitted job. state: queued -> running -> done | failed; a running job whose lease ran out goes
        -- back to queued with attempt + 1. claim is the fencing token: raised by every claim, checked by every write.
        CREATE TABLE jobs (
            id            bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
            name          text        NOT NULL,
            kind          text        NOT NULL,
            state         text        NOT NULL DEFAULT 'queued' CHECK (state IN ('queued', 'running', 'done', 'failed')),
            priority      integer     NOT NULL DEFAULT 0,
            solvers       text,
            time_seconds  double precision,
            iterations    bigint,
            objective     text,
            seed          integer,
            experiment_id bigint,
            attempt       integer     NOT NULL DEFAULT 1,
            claim         bigint      NOT NULL DEFAULT 0,
            worker        text,
            claimed_at    timestamptz,
            lease_until   timestamptz,
            progress      jsonb,
            submitted_at  timestamptz NOT NULL DEFAULT now(),
            submitted_by  text,
            finished_at   timestamptz,
            error         text
        );
        CREATE INDEX jobs_queued ON jobs (priority DESC, id) WHERE state = 'queued';
        CREATE INDEX jobs_leases ON jobs (lease_until) WHERE state = 'running';
        CREATE INDEX jobs_finished ON jobs (finished_at) WHERE finished_at IS NOT NULL;

        -- The input as submitted (every file of a CSV job folder, a .zip, a benchmark file), so a job never depends
        -- on the submitter's disk.
        CREATE TABLE job_inputs (
            job_id  bigint NOT NULL REFERENCES jobs (id) ON DELETE CASCADE,
            path    text   NOT NULL,
            content bytea  NOT NULL,
            PRIMARY KEY (job_id, path)
        );

        -- What each claim did, for audits and the tests: claimed, done, requeued, expired, refused, failed, retry.
        CREATE TABLE job_events (
            id     bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
            job_id bigint      NOT NULL REFERENCES jobs (id) ON DELETE CASCADE,
            at     timestamptz NOT NULL DEFAULT now(),
            claim  bigint      NOT NULL,
            worker text,
            event  text        NOT NULL,
            detail text
        );
        CREATE INDEX job_events_job ON job_events (job_id);

        -- A job's result, written in the transaction that ends its claim, and only by the claim that holds it.
        CREATE TABLE results (
            job_id         bigint PRIMARY KEY REFERENCES jobs (id) ON DELETE CASCADE,
            claim          bigint           NOT NULL,
            attempt        integer          NOT NULL,
            worker         text             NOT NULL,
            instance       text             NOT NULL,
            solver         text             NOT NULL,
            objective_kind text             NOT NULL,
            objective      double precision NOT NULL,
            distance       double precision NOT NULL,
            duration       double precision NOT NULL,
            vehicles       integer          NOT NULL,
            feasible       boolean          NOT NULL,
            unserved       integer          NOT NULL,
            interrupted    boolean          NOT NULL,
            seconds        double precision NOT NULL,
            finished_at    timestamptz      NOT NULL DEFAULT now(),
            summary        jsonb            NOT NULL
        );

        -- The run folder's files (routes.csv, summary.json, trace.csv, run.json, the pictures, report.html).
        CREATE TABLE result_files (
            job_id     bigint NOT NULL REFERENCES jobs (id) ON DELETE CASCADE,
            name       text   NOT NULL,
            media_type text   NOT NULL,
            content    bytea  NOT NULL,
            PRIMARY KEY (job_id, name)
        );

        -- The written plan, one row per visit (routes.csv in rows; times in the instance's unit, minutes for CSV jobs).
        CREATE TABLE plan_rows (
            job_id    bigint           NOT NULL REFERENCES jobs (id) ON DELETE CASCADE,
            vehicle   text             NOT NULL,
            sequence  integer          NOT NULL,
            stop      text             NOT NULL,
            arrival   double precision NOT NULL,
            start     double precision NOT NULL,
            departure double precision NOT NULL,
            wait      double precision NOT NULL,
            late      double precision NOT NULL,
            PRIMARY KEY (job_id, vehicle, sequence)
        );

        -- `anneal bench --db`: one experiment per invocation, one row per finished run (the columns of results.csv).
        CREATE TABLE experiments (
            id         bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
            created_at timestamptz NOT NULL DEFAULT now(),
            out_folder text,
            settings   jsonb NOT NULL
        );
        ALTER TABLE jobs ADD FOREIGN KEY (experiment_id) REFERENCES experiments (id) ON DELETE SET NULL;

        CREATE TABLE bench_results (
            job_id             bigint PRIMARY KEY REFERENCES jobs (id) ON DELETE CASCADE,
            experiment_id      bigint           NOT NULL REFERENCES experiments (id) ON DELETE CASCADE,
            instance           text             NOT NULL,
            solver             text             NOT NULL,
            seed               integer          NOT NULL,
            budget_s           double precision NOT NULL,
            objective          text             NOT NULL,
            objective_value    double precision NOT NULL,
            vehicles           integer          NOT NULL,
            distance           double precision NOT NULL,
            feasible           boolean          NOT NULL,
            seconds_to_best    double precision NOT NULL,
            seconds            double precision NOT NULL,
            reference          double precision,
            reference_vehicles integer,
            gap_pct            double precision
        );
        CREATE INDEX bench_results_experiment ON bench_results (experiment_id);
        """,
        """
        -- A run of a benchmark is known by its key (instance, solver, seed, budget, objective), so that an interrupted
        -- `anneal bench --db` collects the jobs it already submitted instead of submitting them again.
        ALTER TABLE jobs ADD COLUMN label text;
        CREATE INDEX jobs_experiment ON jobs (experiment_id, label) WHERE experiment_id IS NOT NULL;

        -- Whether the run produced a plan at all (a gap is only measured for one that did), and a proven lower bound.
        ALTER TABLE bench_results ADD COLUMN has_plan boolean NOT NULL DEFAULT true,
                                  ADD COLUMN lower_bound double precision,
                                  ADD COLUMN bound_only boolean NOT NULL DEFAULT false;
        """,
    ];

    /// <summary>Creates or migrates the schema to <see cref="Version"/>; returns the version found before (0 for an empty database).</summary>
    /// <param name="upTo">The version to stop at; lower than <see cref="Version"/> only to test migrations.</param>
    /// <exception cref="QueueException">when the database is at a newer version than this build knows.</exception>
    public static async Task<int> InitAsync(NpgsqlDataSource db, CancellationToken cancel, int upTo = Version)
    {
        await using var conn = await db.OpenConnectionAsync(cancel);
        await using var tx = await conn.BeginTransactionAsync(cancel);
        await using (var lockCmd = new NpgsqlCommand("SELECT pg_advisory_xact_lock(@key)", conn, tx))
        {
            lockCmd.Parameters.AddWithValue("key", InitLock);
            await lockCmd.ExecuteNonQueryAsync(cancel);
        }

        int found = await ReadVersionAsync(conn, tx, cancel) ?? 0;
        if (found > Version)
        {
            throw QueueException.NewerSchema(found);
        }

        for (int v = found + 1; v <= upTo; v++)
        {
            await using var step = new NpgsqlCommand(Steps[v - 1], conn, tx);
            await step.ExecuteNonQueryAsync(cancel);
        }

        if (found < upTo)
        {
            await using var stamp = new NpgsqlCommand("DELETE FROM anneal_schema; INSERT INTO anneal_schema (version) VALUES (@v)", conn, tx);
            stamp.Parameters.AddWithValue("v", upTo);
            await stamp.ExecuteNonQueryAsync(cancel);
        }

        await tx.CommitAsync(cancel);
        return found;
    }

    /// <summary>Refuses a database without the schema or at another version, saying what to do.</summary>
    /// <exception cref="QueueException">when the schema is missing or at another version.</exception>
    public static async Task CheckAsync(NpgsqlConnection conn, CancellationToken cancel)
    {
        int? found = await ReadVersionAsync(conn, null, cancel);
        if (found is null)
        {
            throw QueueException.NoSchema();
        }

        if (found > Version)
        {
            throw QueueException.NewerSchema(found.Value);
        }

        if (found < Version)
        {
            throw QueueException.OlderSchema(found.Value);
        }
    }

    private static async Task<int?> ReadVersionAsync(NpgsqlConnection conn, NpgsqlTransaction? tx, CancellationToken cancel)
    {
        await using (var exists = new NpgsqlCommand("SELECT to_regclass('anneal_schema') IS NOT NULL", conn, tx))
        {
            if (!(bool)(await exists.ExecuteScalarAsync(cancel))!)
            {
                return null;
            }
        }

        await using var read = new NpgsqlCommand("SELECT max(version) FROM anneal_schema", conn, tx);
        return await read.ExecuteScalarAsync(cancel) is int v ? v : null;
    }
}
