using System.Globalization;
using System.Text.Json;
using Anneal.Tests.Fixtures;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Queue;

/// <summary>
/// `anneal worker --db` as real processes on a real PostgreSQL server (issue 25): jobs are solved through the one job
/// runner and stored with their files, each job is done exactly once whatever happens to the workers, a stop by SIGTERM
/// keeps the best plan, and the logs can be JSON lines with event ids. The promises of a trusted queue are common
/// practice (claims with SKIP LOCKED, leases, fencing tokens); the PostgreSQL manual documents SKIP LOCKED under
/// SELECT's locking clause.
/// </summary>
public sealed class QueueWorkerTests(PostgresCluster cluster) : QueueTest(cluster)
{
    [SkippableFact]
    public void A_worker_solves_every_kind_of_job_and_fetch_writes_the_files_solve_writes()
    {
        Init();
        string folder = WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 1);
        string zipped = Path.Combine(Dir, "quay.zip");
        System.IO.Compression.ZipFile.CreateFromDirectory(WorkerJobs.WriteValid(Path.Combine(Dir, "src", "quay"), 2), zipped);
        var ids = Submit("--time", "5", "--iterations", "2000", "--solvers", "sa", folder, zipped, BenchmarkData.File("solomon/c101.txt"));

        using (var worker = Worker(new() { ["ANNEAL_Logging__Console__FormatterName"] = "json" }, "--once"))
        {
            Assert.True(worker.WaitForExit(90) == 0, worker.Log);

            // Every log line is one JSON object with an event id; the connection's password appears nowhere.
            foreach (var line in worker.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries))
            {
                using var entry = JsonDocument.Parse(line);
                Assert.True(entry.RootElement.GetProperty("EventId").GetInt32() > 0, line);
            }

            Assert.DoesNotContain(Password, worker.Log, StringComparison.Ordinal);
            Assert.Contains("\"EventId\":2509", worker.Log, StringComparison.Ordinal);
        }

        var status = Status();
        Assert.Equal(3, status.GetProperty("done").GetInt32());
        Assert.Equal(0, status.GetProperty("queued").GetInt32() + status.GetProperty("running").GetInt32() + status.GetProperty("failed").GetInt32());

        var (code, output, err) = Anneal("queue", "fetch", "--db", Db, "--all", "--out", Path.Combine(Dir, "got"));
        Assert.True(code == 0, err + output);
        foreach (long id in ids)
        {
            string run = Path.Combine(Dir, "got", id.ToString(CultureInfo.InvariantCulture));
            foreach (var file in new[] { "routes.csv", "summary.json", "trace.csv", "run.json", "report.html", "routes.png", "convergence.png", "job.json" })
            {
                Assert.True(File.Exists(Path.Combine(run, file)), $"{file} is missing in {run}");
            }

            // The plan rows in the table are the stop rows of routes.csv (its third column says start, stop or end); the result row agrees with summary.json.
            int visits = File.ReadAllLines(Path.Combine(run, "routes.csv")).Skip(1).Count(line => line.Split(',')[2] == "stop");
            Assert.Equal((long)visits, Scalar<long>($"SELECT count(*) FROM plan_rows WHERE job_id = {id}"));
            using var summary = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(run, "summary.json")));
            Assert.Equal(summary.RootElement.GetProperty("plan").GetProperty("objective").GetDouble(), Scalar<double>($"SELECT objective FROM results WHERE job_id = {id}"), 6);
            Assert.False(summary.RootElement.GetProperty("interrupted").GetBoolean());
        }

        // c101 is Solomon's file, read as a benchmark (distance objective) just as `anneal solve` reads it.
        Assert.Equal("distance", Scalar<string>($"SELECT objective_kind FROM results WHERE job_id = {ids[2]}"));
        AssertExactlyOnce(3);
    }

    [SkippableFact]
    public void Three_workers_killed_ten_times_at_random_still_do_every_job_exactly_once()
    {
        Init();
        var paths = Enumerable.Range(1, 60).Select(k => WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", $"depot-{k:00}"), 100 + k)).ToArray();
        Submit(["--time", "5", "--iterations", "3000", "--solvers", "sa", .. paths]);
        // In the worker's process: this is about claims and leases, and 60 solver processes would cost minutes here.
        var fast = new Dictionary<string, string>
        {
            ["ANNEAL_Queue__LeaseSeconds"] = "3", ["ANNEAL_Queue__HeartbeatSeconds"] = "0.5", ["ANNEAL_Worker__MaxRetries"] = "20", ["ANNEAL_Worker__Isolation"] = "InProcess",
        };
        var workers = new[] { Worker(fast), Worker(fast), Worker(fast) };
        try
        {
            // Seeded, so a failure can be replayed: which worker dies, and when.
            var random = new Random(25);
            for (int kill = 0; kill < 10; kill++)
            {
                Thread.Sleep(random.Next(300, 1500));
                int victim = random.Next(workers.Length);
                workers[victim].Kill();
                workers[victim].Dispose();
                workers[victim] = Worker(fast);
            }

            WaitUntil(() => Status().GetProperty("done").GetInt32() == 60, 150, () => string.Join("\n---\n", workers.Select(w => w.Log)));
            foreach (var w in workers)
            {
                w.Terminate();
                Assert.True(w.WaitForExit(30) == 130, w.Log);
            }
        }
        finally
        {
            foreach (var w in workers)
            {
                w.Dispose();
            }
        }

        Assert.Equal(0, Status().GetProperty("failed").GetInt32());
        AssertExactlyOnce(60);
    }

    [SkippableFact]
    public void A_solver_process_that_aborts_fails_its_job_once_with_the_reason_and_the_worker_solves_the_next()
    {
        // Issue 19: as the folder worker, each job's search runs in `anneal run-job`; the process aborts itself (libc
        // abort(), as a failed check in native code does) when sa begins, so the second job uses tabu.
        Init();
        long crash = Submit("--time", "60", "--solvers", "sa", WorkerJobs.WriteValid(Path.Combine(Dir, "crash"), 5))[0];
        long after = Submit("--time", "1", "--iterations", "500", "--solvers", "tabu", WorkerJobs.WriteValid(Path.Combine(Dir, "after"), 6))[0];

        using (var worker = Worker(new() { [global::Anneal.Worker.Isolation.ChildSide.AbortSwitch] = "sa" }, "--once"))
        {
            Assert.True(worker.WaitForExit(120) == 0, worker.Log);
            Assert.Contains($"Job {crash} failed in its solver process", worker.Log, StringComparison.Ordinal);
        }

        Assert.Equal("failed", Scalar<string>($"SELECT state FROM jobs WHERE id = {crash}"));
        string error = Scalar<string>($"SELECT error FROM jobs WHERE id = {crash}");
        Assert.Contains("the solver process ended with signal 6", error, StringComparison.Ordinal);
        Assert.Contains("in the sa phase", error, StringComparison.Ordinal);

        // Failed once, at once: no retry spent on a crash the same input would repeat.
        Assert.Equal(1, Scalar<int>($"SELECT attempt FROM jobs WHERE id = {crash}"));
        Assert.Equal(1L, Scalar<long>($"SELECT count(*) FROM job_events WHERE job_id = {crash} AND event = 'failed'"));
        Assert.Equal("done", Scalar<string>($"SELECT state FROM jobs WHERE id = {after}"));
        Assert.Equal(0L, Scalar<long>($"SELECT count(*) FROM results WHERE job_id = {crash}"));
        Assert.True(Scalar<long>($"SELECT count(*) FROM plan_rows WHERE job_id = {after}") > 0);
    }

    [SkippableFact]
    public void The_database_stopped_for_ten_seconds_mid_run_loses_nothing_and_running_searches_are_kept()
    {
        Init();
        var paths = Enumerable.Range(1, 10).Select(k => WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", $"depot-{k:00}"), 200 + k)).ToArray();
        Submit(["--time", "3", "--solvers", "sa", .. paths]);
        var patient = new Dictionary<string, string> { ["ANNEAL_Queue__LeaseSeconds"] = "30", ["ANNEAL_Queue__HeartbeatSeconds"] = "1", ["ANNEAL_Queue__RetryMaxSeconds"] = "1" };
        using var a = Worker(patient);
        using var b = Worker(patient);
        WaitUntil(() => Status().GetProperty("done").GetInt32() >= 2, 60, () => a.Log + "\n---\n" + b.Log);

        // Stop while a search runs (on a loaded machine both workers may be between jobs at any one moment).
        WaitUntil(() => Status().GetProperty("running").GetInt32() >= 1, 60, () => a.Log + "\n---\n" + b.Log);
        var stoppedAt = Scalar<DateTime>("SELECT now()");
        Cluster.Stop();
        Thread.Sleep(10_000);
        Cluster.Start();
        var backAt = Scalar<DateTime>("SELECT now()");

        WaitUntil(() => Status().GetProperty("done").GetInt32() == 10, 90, () => a.Log + "\n---\n" + b.Log);
        a.Terminate();
        b.Terminate();
        Assert.True(a.WaitForExit(30) == 130, a.Log);
        Assert.True(b.WaitForExit(30) == 130, b.Log);

        AssertExactlyOnce(10);
        Assert.Contains("[2505]", a.Log + b.Log, StringComparison.Ordinal);

        // No lease ran out (30 s > 10 s), so no job was solved twice: the searches running at the stop were stored afterwards.
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM jobs WHERE attempt <> 1"));
        long kept = Scalar<long>(string.Create(CultureInfo.InvariantCulture,
            $"SELECT count(*) FROM job_events c JOIN job_events d ON d.job_id = c.job_id AND d.claim = c.claim AND d.event = 'done' WHERE c.event = 'claimed' AND c.at < '{stoppedAt:O}' AND d.at > '{backAt:O}'"));
        Assert.True(kept >= 1, "no search that was running when the database stopped was stored after it came back");
    }

    [SkippableFact]
    public void A_frozen_worker_whose_lease_ran_out_has_its_late_result_refused()
    {
        Init();
        long id = Submit("--time", "4", "--solvers", "sa", WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 5))[0];
        var quick = new Dictionary<string, string> { ["ANNEAL_Queue__LeaseSeconds"] = "3", ["ANNEAL_Queue__HeartbeatSeconds"] = "0.5" };
        using var stale = Worker(quick);
        WaitUntil(() => Status().GetProperty("running").GetInt32() == 1, 30, () => stale.Log);
        stale.Freeze();
        try
        {
            // Only once its lease has run out may another worker take the job over.
            WaitUntil(() => Scalar<bool>($"SELECT lease_until < now() FROM jobs WHERE id = {id}"), 30, () => stale.Log);
            using var fresh = Worker(quick, "--once");
            Assert.True(fresh.WaitForExit(60) == 0, fresh.Log);
        }
        finally
        {
            stale.Continue();
        }

        // Woken, the stale worker finds its claim superseded and its write is refused by the fencing token (and logs it:
        // the line follows the refusal's commit, so wait for both). Its solver process may have written an interrupted
        // plan or been stopped before one; either way the write is refused.
        WaitUntil(() => Scalar<long>($"SELECT count(*) FROM job_events WHERE job_id = {id} AND event = 'refused' AND claim = 1") == 1
            && stale.Log.Contains("[2510]", StringComparison.Ordinal), 30, () => stale.Log);
        stale.Terminate();
        Assert.True(stale.WaitForExit(30) == 130, stale.Log);
        Assert.Equal(2L, Scalar<long>($"SELECT claim FROM results WHERE job_id = {id}"));
        Assert.Equal(2, Scalar<int>($"SELECT attempt FROM results WHERE job_id = {id}"));
        AssertExactlyOnce(1);
    }

    [SkippableFact]
    public void SIGTERM_stores_the_interrupted_plan_and_requeues_the_job_or_completes_it_as_OnShutdown_says()
    {
        Init();
        long id = Submit("--time", "120", "--solvers", "sa", WorkerJobs.WriteValid(Path.Combine(Dir, "long"), 3))[0];
        var beat = new Dictionary<string, string> { ["ANNEAL_Queue__HeartbeatSeconds"] = "0.3" };
        using (var worker = Worker(beat))
        {
            WaitUntilProgress();
            worker.Terminate();
            Assert.True(worker.WaitForExit(30) == 130, worker.Log);
        }

        // OnShutdown = Requeue (the default): queued again with no attempt counted, its interrupted plan stored meanwhile.
        Assert.Equal("queued", Scalar<string>($"SELECT state FROM jobs WHERE id = {id}"));
        Assert.Equal(1, Scalar<int>($"SELECT attempt FROM jobs WHERE id = {id}"));
        Assert.True(Scalar<bool>($"SELECT interrupted FROM results WHERE job_id = {id}"));
        var fetched = Anneal("queue", "fetch", "--db", Db, id.ToString(CultureInfo.InvariantCulture), "--out", Path.Combine(Dir, "got"));
        Assert.Contains("its next run replaces it", fetched.Out, StringComparison.Ordinal);

        using (var worker = Worker(new(beat) { ["ANNEAL_Worker__OnShutdown"] = "Complete" }))
        {
            WaitUntilProgress();
            worker.Terminate();
            Assert.True(worker.WaitForExit(30) == 130, worker.Log);
        }

        Assert.Equal("done", Scalar<string>($"SELECT state FROM jobs WHERE id = {id}"));
        Assert.True(Scalar<bool>($"SELECT interrupted FROM results WHERE job_id = {id}"));
        Assert.Equal(2L, Scalar<long>($"SELECT claim FROM results WHERE job_id = {id}"));
    }

    private const string Password = "Quill-Harbour-77";

    /// <summary>The test's database with a password that trust authentication ignores: it must still never be printed.</summary>
    private string Connection => Db + ";Password=" + Password;

    private WorkerProcess Worker(Dictionary<string, string> settings, params string[] args)
    {
        var environment = new Dictionary<string, string>
        {
            ["ANNEAL_Worker__PollSeconds"] = "0.3",
            ["ANNEAL_Worker__RecoverSeconds"] = "0.5",
            ["ANNEAL_Worker__ShutdownTimeoutSeconds"] = "10",
            ["ANNEAL_Queue__RetryMaxSeconds"] = "1",
        };
        foreach (var (key, value) in settings)
        {
            environment[key] = value;
        }

        return WorkerProcess.Launch(Dir, ["worker", "--db", Connection, .. args], environment);
    }

    private long[] Submit(params string[] args)
    {
        var (code, output, err) = Anneal(["queue", "submit", "--db", Db, .. args]);
        Assert.True(code == 0, err);
        return output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(long.Parse).ToArray();
    }

    private void WaitUntilProgress() =>
        WaitUntil(() => Status().GetProperty("runningJobs").EnumerateArray().Any(j => j.GetProperty("solvers").GetArrayLength() > 0), 30, () => string.Empty);

    /// <summary>
    /// Every job done exactly once: one "done" per job, made by the claim that holds the result, which is the job's
    /// last claim; every refused write came from an older claim. A stale attempt never overwrote a result.
    /// </summary>
    private void AssertExactlyOnce(int jobs)
    {
        Assert.Equal((long)jobs, Scalar<long>("SELECT count(*) FROM jobs WHERE state = 'done'"));
        Assert.Equal((long)jobs, Scalar<long>("SELECT count(*) FROM results"));
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM (SELECT job_id FROM job_events WHERE event = 'done' GROUP BY job_id HAVING count(*) <> 1) x"));
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM results r JOIN jobs j ON j.id = r.job_id WHERE r.claim <> j.claim"));
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM job_events e JOIN results r ON r.job_id = e.job_id WHERE e.event = 'done' AND e.claim <> r.claim"));
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM job_events e JOIN jobs j ON j.id = e.job_id WHERE e.event = 'refused' AND e.claim >= j.claim"));
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM jobs j WHERE NOT EXISTS (SELECT 1 FROM result_files f WHERE f.job_id = j.id AND f.name = 'summary.json')"));
    }

    private static void WaitUntil(Func<bool> condition, double seconds, Func<string> log)
    {
        var deadline = DateTime.UtcNow.AddSeconds(seconds);
        while (DateTime.UtcNow < deadline)
        {
            try
            {
                if (condition())
                {
                    return;
                }
            }
            catch (Npgsql.NpgsqlException)
            {
                // The server is restarting; ask again.
            }

            Thread.Sleep(200);
        }

        Assert.Fail($"not reached within {seconds} s; the workers' logs:\n{log()}");
    }
}
