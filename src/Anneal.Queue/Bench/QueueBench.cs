using System.Globalization;
using System.Text.Json;
using Anneal.Experiments;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Queue.Jobs;
using Npgsql;

namespace Anneal.Queue.Bench;

/// <summary>
/// `anneal bench --db`: every planned run not yet in results.csv becomes a job of one experiment (one solver, its seed
/// and budget), workers on any machines run them, and each finished run is collected as the local runner records it
/// (its trace first, then its row in results.csv). The measures also stay in bench_results for SQL. The experiment's id
/// is kept in queue.json in the output folder: running the same command again collects the jobs already submitted
/// instead of submitting them again. A run cut short by a stopping worker is not recorded (as locally) and is
/// submitted again next time.
/// </summary>
public sealed class QueueBench(NpgsqlDataSource db, Submitter submitter)
{
    public const string StateFile = "queue.json";

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true };

    /// <param name="finished">Called with each run as it is recorded.</param>
    /// <param name="progress">A line on the experiment's progress, every few seconds.</param>
    public async Task<BenchOutcome> RunAsync(
        IReadOnlyList<LoadedInput> inputs, BenchSettings settings, ReferenceValues references, string outDir,
        Action<BenchRow>? finished, Action<string>? progress, CancellationToken cancel)
    {
        Directory.CreateDirectory(Path.Combine(outDir, BenchRunner.TraceFolder));
        string resultsPath = Path.Combine(outDir, BenchRunner.ResultsFile);
        var rows = ResultsCsv.Read(resultsPath).ToList();
        var done = new HashSet<RunKey>(rows.Select(RunKey.Of));
        var plan = BenchRunner.Plan(inputs, settings);
        var work = plan.Where(p => !done.Contains(RunKey.Of(p))).ToList();
        int skipped = plan.Count - work.Count, recorded = 0, dropped = 0;

        long experiment = await ExperimentAsync(outDir, settings, cancel);
        var pending = await SubmitAsync(experiment, work, settings, cancel);
        var last = DateTimeOffset.MinValue;
        while (pending.Count > 0 && !cancel.IsCancellationRequested)
        {
            foreach (var (id, end) in await EndedAsync(pending.Keys, cancel))
            {
                var run = pending[id];
                pending.Remove(id);
                if (end.State == "failed" || end.Measure is null)
                {
                    progress?.Invoke($"run {RunKey.Of(run).Label()} (job {id}) failed: {end.Error}");
                    dropped++;
                    continue;
                }

                if (end.Interrupted)
                {
                    progress?.Invoke($"run {RunKey.Of(run).Label()} (job {id}) was cut short by a stopping worker: not recorded; the next invocation submits it again");
                    dropped++;
                    continue;
                }

                string traceFile = BenchRunner.TraceFile(run);
                var trace = await ResultReader.FileAsync(db, id, TraceCsvWriter.FileName, cancel);
                AtomicFile.Write(Path.Combine(outDir, traceFile), s => s.Write(trace?.Content ?? []));
                var row = BenchRunner.Row(run, end.Measure, references, traceFile);
                rows.Add(row);
                recorded++;
                ResultsCsv.Write(resultsPath, rows);
                await SetGapAsync(id, row, cancel);
                finished?.Invoke(row);
            }

            var now = DateTimeOffset.UtcNow;
            if (pending.Count > 0 && now - last >= TimeSpan.FromSeconds(5))
            {
                last = now;
                var (running, queued) = await WaitingAsync(pending.Keys, cancel);
                progress?.Invoke(string.Create(CultureInfo.InvariantCulture,
                    $"bench: {skipped + recorded} of {plan.Count} runs recorded; {running} running, {queued} queued (experiment {experiment})"));
            }

            try
            {
                await Task.Delay(TimeSpan.FromSeconds(pending.Count > 0 ? 1 : 0), cancel);
            }
            catch (OperationCanceledException)
            {
                break;
            }
        }

        return new BenchOutcome(rows, plan, skipped, recorded, dropped);
    }

    /// <summary>The experiment of this output folder (from queue.json when it names one this database holds), else a new one.</summary>
    private async Task<long> ExperimentAsync(string outDir, BenchSettings settings, CancellationToken cancel)
    {
        string path = Path.Combine(outDir, StateFile);
        if (File.Exists(path))
        {
            try
            {
                var kept = JsonSerializer.Deserialize<ExperimentState>(File.ReadAllBytes(path), Json);
                await using var find = db.CreateCommand("SELECT EXISTS (SELECT 1 FROM experiments WHERE id = @id)");
                find.Parameters.AddWithValue("id", kept?.Experiment ?? 0);
                if (kept is not null && (bool)(await find.ExecuteScalarAsync(cancel))!)
                {
                    return kept.Experiment;
                }
            }
            catch (JsonException)
            {
                // Not ours, or damaged: a new experiment is started below and the file replaced.
            }
        }

        await using var create = db.CreateCommand("INSERT INTO experiments (out_folder, settings) VALUES (@out, @settings::jsonb) RETURNING id");
        create.Parameters.AddWithValue("out", Path.GetFullPath(outDir));
        create.Parameters.AddWithValue("settings", JsonSerializer.Serialize(settings, Json));
        long id = (long)(await create.ExecuteScalarAsync(cancel))!;
        AtomicFile.Write(path, s => JsonSerializer.Serialize(s, new ExperimentState(id), Json));
        return id;
    }

    /// <summary>Job ids of the runs to wait for: those the experiment already holds (queued, running or done in full), the rest submitted now.</summary>
    private async Task<Dictionary<long, PlannedRun>> SubmitAsync(long experiment, List<PlannedRun> work, BenchSettings settings, CancellationToken cancel)
    {
        var known = new Dictionary<string, long>(StringComparer.Ordinal);
        await using (var cmd = db.CreateCommand(
            """
            SELECT j.id, j.label FROM jobs j LEFT JOIN results r ON r.job_id = j.id
            WHERE j.experiment_id = @e AND j.label IS NOT NULL AND j.state <> 'failed' AND NOT (j.state = 'done' AND coalesce(r.interrupted, false))
            ORDER BY j.id
            """))
        {
            cmd.Parameters.AddWithValue("e", experiment);
            await using var r = await cmd.ExecuteReaderAsync(cancel);
            while (await r.ReadAsync(cancel))
            {
                known[r.GetString(1)] = r.GetInt64(0);
            }
        }

        var pending = new Dictionary<long, PlannedRun>();
        var fresh = new List<PlannedRun>();
        foreach (var run in work)
        {
            if (known.TryGetValue(RunKey.Of(run).Label(), out long id))
            {
                pending[id] = run;
            }
            else
            {
                fresh.Add(run);
            }
        }

        var packedByInput = new Dictionary<string, Submitter.Packed>(StringComparer.Ordinal);
        var jobs = new List<Submitter.Packed>();
        foreach (var run in fresh)
        {
            if (!packedByInput.TryGetValue(run.Input.Path, out var packed))
            {
                packed = submitter.Pack(run.Input.Path, new JobSpec());
                packedByInput[run.Input.Path] = packed;
            }

            jobs.Add(packed with
            {
                Spec = new JobSpec
                {
                    Solvers = run.Solver,
                    TimeSeconds = run.BudgetSeconds,
                    Iterations = settings.Iterations,
                    Objective = run.Instance.Objective,
                    Seed = run.Seed,
                    ExperimentId = experiment,
                    Label = RunKey.Of(run).Label(),
                },
            });
        }

        var ids = jobs.Count == 0 ? [] : await submitter.InsertAsync(jobs, cancel);
        for (int k = 0; k < ids.Count; k++)
        {
            pending[ids[k]] = fresh[k];
        }

        return pending;
    }

    private sealed record Ended(string State, string? Error, bool Interrupted, RunMeasure? Measure);

    private async Task<List<(long Id, Ended End)>> EndedAsync(IEnumerable<long> ids, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand(
            """
            SELECT j.id, j.state, j.error, coalesce(r.interrupted, false),
                   b.objective_value, b.vehicles, b.distance, b.feasible, b.has_plan, b.seconds_to_best, b.seconds, b.lower_bound, coalesce(b.bound_only, false)
            FROM jobs j LEFT JOIN results r ON r.job_id = j.id LEFT JOIN bench_results b ON b.job_id = j.id
            WHERE j.id = ANY(@ids) AND j.state IN ('done', 'failed') ORDER BY j.id
            """);
        cmd.Parameters.AddWithValue("ids", ids.ToArray());
        var list = new List<(long, Ended)>();
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        while (await r.ReadAsync(cancel))
        {
            var measure = r.IsDBNull(4) ? null
                : new RunMeasure(r.GetDouble(4), r.GetInt32(5), r.GetDouble(6), r.GetBoolean(7), r.GetBoolean(8), r.GetDouble(9), r.GetDouble(10),
                    r.IsDBNull(11) ? null : r.GetDouble(11), r.GetBoolean(12));
            list.Add((r.GetInt64(0), new Ended(r.GetString(1), r.IsDBNull(2) ? null : r.GetString(2), r.GetBoolean(3), measure)));
        }

        return list;
    }

    private async Task<(int Running, int Queued)> WaitingAsync(IEnumerable<long> ids, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("SELECT count(*) FILTER (WHERE state = 'running')::int, count(*) FILTER (WHERE state = 'queued')::int FROM jobs WHERE id = ANY(@ids)");
        cmd.Parameters.AddWithValue("ids", ids.ToArray());
        await using var r = await cmd.ExecuteReaderAsync(cancel);
        await r.ReadAsync(cancel);
        return (r.GetInt32(0), r.GetInt32(1));
    }

    /// <summary>The reference and gap, known only here (the reference file is the submitter's), for analysts' queries.</summary>
    private async Task SetGapAsync(long id, BenchRow row, CancellationToken cancel)
    {
        await using var cmd = db.CreateCommand("UPDATE bench_results SET reference = @reference, reference_vehicles = @vehicles, gap_pct = @gap WHERE job_id = @id");
        cmd.Parameters.Add(Submitter.Nullable("reference", NpgsqlTypes.NpgsqlDbType.Double, row.Reference));
        cmd.Parameters.Add(Submitter.Nullable("vehicles", NpgsqlTypes.NpgsqlDbType.Integer, row.ReferenceVehicles));
        cmd.Parameters.Add(Submitter.Nullable("gap", NpgsqlTypes.NpgsqlDbType.Double, row.GapPercent));
        cmd.Parameters.AddWithValue("id", id);
        await cmd.ExecuteNonQueryAsync(cancel);
    }

    private sealed record ExperimentState(long Experiment);
}
