using System.Globalization;
using Anneal.Cli;
using Anneal.Experiments;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Queue;

/// <summary>
/// `anneal bench --db` (issue 25): the runs go to the queue, a worker process runs them, the usual outputs appear, the
/// measures stay in bench_results, and an interrupted benchmark collects its jobs instead of submitting them again.
/// With an iteration budget the runs are reproducible (same input, seed and iterations give the same routes: the
/// project's own rule), so the queue's results must equal a local benchmark's.
/// </summary>
public sealed class QueueBenchTests(PostgresCluster cluster) : QueueTest(cluster)
{
    [SkippableFact]
    public void Bench_through_the_queue_gives_the_local_results_and_resumes_without_submitting_again()
    {
        Init();
        string[] instances = [WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", "north"), 41), WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", "quay"), 42)];
        string[] common = ["bench", .. instances, "--solvers", "sa", "--seeds", "2", "--time", "30", "--iterations", "400", "--throughput-seconds", "0"];
        string queued = Path.Combine(Dir, "queued");

        // No worker yet: the runs wait in the queue until the benchmark is stopped.
        using (var stop = new CancellationTokenSource(TimeSpan.FromSeconds(3)))
        {
            var context = new CliContext(new StringWriter(), new StringWriter()) { Cancel = stop.Token };
            Assert.Equal(ExitCodes.Interrupted, CliApp.Run([.. common, "--out", queued, "--db", Db], context));
            Assert.Contains("remain in the queue", context.Out.ToString(), StringComparison.Ordinal);
        }

        Assert.Equal(4, Status().GetProperty("queued").GetInt32());
        using var worker = WorkerProcess.Launch(Dir, ["worker", "--db", Db], new Dictionary<string, string> { ["ANNEAL_Worker__PollSeconds"] = "0.3" });
        var (code, output, err) = Anneal([.. common, "--out", queued, "--db", Db]);
        worker.Terminate();
        Assert.True(worker.WaitForExit(30) == 130, worker.Log);
        Assert.True(code == 0, err + output + worker.Log);

        // The second invocation collected the four jobs the first had submitted.
        Assert.Equal(4L, Scalar<long>("SELECT count(*) FROM jobs"));
        Assert.Equal(1L, Scalar<long>("SELECT count(*) FROM experiments"));
        var remote = ResultsCsv.Read(Path.Combine(queued, BenchRunner.ResultsFile));
        Assert.Equal(4, remote.Count);
        foreach (var row in remote)
        {
            Assert.True(new FileInfo(Path.Combine(queued, row.TraceFile)).Length > 0, row.TraceFile);
            string key = string.Create(CultureInfo.InvariantCulture, $"instance = '{row.Instance}' AND seed = {row.Seed}");
            // results.csv keeps six decimals.
            Assert.Equal(row.ObjectiveValue, Scalar<double>($"SELECT objective_value FROM bench_results WHERE {key}"), 5);
        }

        Assert.True(File.Exists(Path.Combine(queued, "summary.html")));

        var (localCode, _, localErr) = Anneal([.. common, "--out", Path.Combine(Dir, "local")]);
        Assert.True(localCode == 0, localErr);
        var local = ResultsCsv.Read(Path.Combine(Dir, "local", BenchRunner.ResultsFile));
        Assert.Equal(
            local.Select(r => (r.Instance, r.Seed, r.ObjectiveValue, r.Vehicles)).Order(),
            remote.Select(r => (r.Instance, r.Seed, r.ObjectiveValue, r.Vehicles)).Order());
    }
}
