using System.Text.Json;

namespace Anneal.Tests.Worker;

/// <summary>
/// The worker's promises from issue 6, checked on the real executable: every job ends solved or explained exactly once,
/// whatever happens to the process. Exit codes are the project's shared table (0 done, 130 stopped by a signal).
/// </summary>
public sealed class WorkerTests : WorkerTest
{
    [Fact]
    public void Valid_jobs_are_solved_and_broken_ones_explained_with_row_and_column()
    {
        for (int k = 1; k <= 4; k++)
        {
            WorkerJobs.DropValid(Dir, $"depot-{k}", k);
        }

        WorkerJobs.DropBadDemand(Dir, "bad-demand");
        WorkerJobs.DropBadShift(Dir, "bad-shift");

        using var worker = WorkerProcess.Start(Dir, "--once", "--time", "1", "--solvers", "sa", "--jobs", "2");
        Assert.True(worker.WaitForExit() == 0, worker.Log);

        Assert.Equal(["depot-1", "depot-2", "depot-3", "depot-4"], Names(Outbox));
        foreach (var job in Names(Outbox))
        {
            AssertComplete(Path.Combine(Outbox, job), interrupted: false);
        }

        Assert.Equal(["bad-demand", "bad-shift"], Names(Failed));
        string demand = File.ReadAllText(Path.Combine(Failed, "bad-demand", "error.txt"));
        Assert.Contains("stops.csv, row 3, column 'demand_kg'", demand, StringComparison.Ordinal);
        string shift = File.ReadAllText(Path.Combine(Failed, "bad-shift", "error.txt"));
        Assert.Contains("vehicles.csv, row 2, column 'shift_start'", shift, StringComparison.Ordinal);

        // The input is kept as given, so it can be fixed and dropped again.
        Assert.True(File.Exists(Path.Combine(Failed, "bad-demand", "bad-demand", "stops.csv")));
        AssertNothingLeft();
    }

    [Fact]
    public void A_worker_killed_mid_job_loses_nothing_and_the_next_one_finishes_every_job_once()
    {
        string[] jobs = ["north", "quay", "south"];
        for (int k = 0; k < jobs.Length; k++)
        {
            WorkerJobs.DropValid(Dir, jobs[k], 10 + k);
        }

        using (var first = WorkerProcess.Start(Dir, "--time", "60", "--solvers", "sa"))
        {
            WaitUntilSolving(first);
            first.Kill();
        }

        // The killed worker's claim is still on disk, not lost.
        Assert.Single(Directory.GetDirectories(Working).SelectMany(Directory.GetFileSystemEntries));

        using var second = WorkerProcess.Start(Dir, "--once", "--time", "1", "--solvers", "sa");
        Assert.True(second.WaitForExit() == 0, second.Log);

        Assert.Equal(jobs, Names(Outbox));
        foreach (var job in jobs)
        {
            AssertComplete(Path.Combine(Outbox, job), interrupted: false);
        }

        // The killed job was solved on its second attempt, the others on their first.
        int retried = jobs.Count(j => Record(Path.Combine(Outbox, j)).GetProperty("attempt").GetInt32() == 2);
        Assert.Equal(1, retried);
        Assert.Empty(Names(Failed));
        AssertNothingLeft();
    }

    [Fact]
    public void Two_workers_on_one_inbox_solve_each_job_exactly_once()
    {
        var jobs = Enumerable.Range(1, 10).Select(k => $"job-{k:00}").ToArray();
        for (int k = 0; k < jobs.Length; k++)
        {
            WorkerJobs.DropValid(Dir, jobs[k], 20 + k);
        }

        // The construction alone ends by itself in milliseconds, so no clock decides how a job ends (a short sa budget
        // left a job without a plan when a loaded machine starved the search past its budget and tolerance). Claiming
        // is what is tested here: the searches run in the workers' processes to keep ten jobs quick.
        var inProcess = new Dictionary<string, string> { ["Isolation"] = "InProcess" };
        using var a = WorkerProcess.Start(Dir, inProcess, "--once", "--time", "60", "--solvers", "insertion");
        using var b = WorkerProcess.Start(Dir, inProcess, "--once", "--time", "60", "--solvers", "insertion");
        // Ten jobs between two processes: a hang guard generous enough for a loaded machine, not a measurement.
        Assert.True(a.WaitForExit(120) == 0, a.Log);
        Assert.True(b.WaitForExit(120) == 0, b.Log);

        // A second solve of a job would show as a "job-01-2" folder and as an eleventh "done" in the status files.
        Assert.Equal(jobs, Names(Outbox));
        int done = Directory.GetFiles(Working, "*.status.json").Sum(f => Json(f).GetProperty("done").GetInt32());
        Assert.Equal(10, done);
        foreach (var job in jobs)
        {
            AssertComplete(Path.Combine(Outbox, job), interrupted: false);
        }

        AssertNothingLeft();
    }

    [Fact]
    public void SIGTERM_during_a_long_job_writes_the_interrupted_plan_and_requeues_the_job()
    {
        WorkerJobs.DropValid(Dir, "long", 3);
        using var worker = WorkerProcess.Start(Dir, "--time", "120", "--solvers", "sa");
        WaitUntilSolving(worker);
        worker.Terminate();

        // ShutdownTimeoutSeconds is 10 here; the deadline is generous on purpose.
        Assert.True(worker.WaitForExit(60) == 130, worker.Log);
        Assert.True(File.Exists(Path.Combine(Outbox, "long", "routes.csv")), worker.Log);
        AssertComplete(Path.Combine(Outbox, "long"), interrupted: true);
        Assert.False(Record(Path.Combine(Outbox, "long")).GetProperty("final").GetBoolean());

        // OnShutdown = Requeue (the default): the job is back in the inbox as it was, with no retry counted.
        Assert.Equal(["long"], Names(Inbox));
        Assert.Empty(Directory.GetDirectories(Working));
    }
}
