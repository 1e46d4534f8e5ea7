using Anneal.Worker;
using Anneal.Worker.Isolation;

namespace Anneal.Tests.Worker;

/// <summary>
/// Issue 19: each job's search runs in its own `anneal run-job` process, so a native abort, an out-of-memory kill or a
/// hang is that job's failure and the worker goes on. Real processes and real signals: the solver process calls libc
/// abort(), as a failed check in OR-Tools' native code does, or is sent SIGKILL, as the kernel's out-of-memory killer
/// does. The worker's own SIGTERM reaching the solver process is covered by WorkerTests (isolation is the default).
/// </summary>
public sealed class IsolationTests : WorkerTest
{
    [Fact]
    public void A_solver_process_that_aborts_fails_its_job_once_and_the_worker_solves_the_next()
    {
        // The .NET runtime ignores a SIGABRT sent from outside, so the process aborts itself as native code does.
        WorkerJobs.DropValid(Dir, "crash", 5, timeSeconds: 120, "sa");
        using var worker = WorkerProcess.Start(Dir, new Dictionary<string, string>(), new Dictionary<string, string> { [ChildSide.AbortSwitch] = "sa" }, "--time", "1");
        WaitFor(() => Names(Failed).Contains("crash"), worker, "the crashed job in failed/");
        AssertFailedOnceAndServing(worker, 6);
    }

    [Fact]
    public void A_solver_process_killed_by_SIGKILL_fails_its_job_once_and_the_worker_solves_the_next()
    {
        WorkerJobs.DropValid(Dir, "crash", 5, timeSeconds: 120, "sa");
        using var worker = WorkerProcess.Start(Dir, "--time", "1");
        WaitUntilSolving(worker);
        ChildProcesses.Signal(Assert.Single(worker.SolverProcesses()), "KILL");
        WaitFor(() => Names(Failed).Contains("crash"), worker, "the crashed job in failed/");
        AssertFailedOnceAndServing(worker, 9);
    }

    [Fact]
    public void A_solver_process_that_hangs_past_its_budget_and_grace_is_killed_its_job_fails_and_the_worker_solves_the_next()
    {
        // SIGSTOP freezes the process as a hang in native code would: it cannot even answer the SIGTERM it is sent.
        // Budget 3 s, grace 10 s (HangGraceSeconds; 30 s in service), then 1 s for SIGTERM before the kill. The grace
        // counts from the process's start, so it must also cover start-up and writing on a loaded machine (1 s did not
        // for the next job at a load of 25).
        WorkerJobs.DropValid(Dir, "crash", 5, timeSeconds: 3, "sa");
        var settings = new Dictionary<string, string> { ["HangGraceSeconds"] = "10", ["ShutdownTimeoutSeconds"] = "1" };
        using var worker = WorkerProcess.Start(Dir, settings, "--time", "1");
        WaitUntilSolving(worker);
        int solver = Assert.Single(worker.SolverProcesses());
        ChildProcesses.Signal(solver, "STOP");
        WaitFor(() => Names(Failed).Contains("crash"), worker, "the hung job in failed/");

        Assert.False(ChildProcesses.Alive(solver), "the hung solver process is still there");
        string error = File.ReadAllText(Path.Combine(Failed, "crash", FailedJobs.ErrorFile));
        Assert.Contains("the solver process was still running", error, StringComparison.Ordinal);
        Assert.Contains("past its budget and grace of", error, StringComparison.Ordinal);
        Assert.Contains("and was stopped in the sa phase", error, StringComparison.Ordinal);
        AssertServing(worker);
    }

    private void AssertFailedOnceAndServing(WorkerProcess worker, int number)
    {
        string error = File.ReadAllText(Path.Combine(Failed, "crash", FailedJobs.ErrorFile));
        Assert.Contains($"the solver process ended with signal {number}", error, StringComparison.Ordinal);
        Assert.Contains("in the sa phase", error, StringComparison.Ordinal);
        AssertServing(worker);
    }

    private void AssertServing(WorkerProcess worker)
    {
        // tabu, so that the abort switch (set for sa) leaves it alone.
        WorkerJobs.DropValid(Dir, "after", 6, timeSeconds: 1, "tabu");
        WaitFor(() => Names(Outbox).Contains("after"), worker, "the next job in the outbox");

        Assert.False(worker.HasExited, worker.Log);

        // Failed once, at once: no retry spent on a crash the same input would repeat, and the input is kept as given.
        Assert.Equal(["crash"], Names(Failed));
        Assert.True(File.Exists(Path.Combine(Failed, "crash", "crash", "stops.csv")));
        AssertComplete(Path.Combine(Outbox, "after"), interrupted: false);
        Assert.Equal(["after"], Names(Outbox));

        worker.Terminate();
        Assert.True(worker.WaitForExit(60) == 130, worker.Log);
        AssertNothingLeft();
    }

    [Fact]
    public void A_solver_process_whose_worker_is_killed_stops_by_itself_and_the_next_worker_solves_the_job()
    {
        WorkerJobs.DropValid(Dir, "orphan", 7);
        int solver;
        using (var first = WorkerProcess.Start(Dir, "--time", "120", "--solvers", "sa"))
        {
            WaitUntilSolving(first);
            solver = Assert.Single(first.SolverProcesses());
            first.KillAlone();
        }

        // Its standard input closes with the worker; it must not search on for two minutes.
        var deadline = DateTime.UtcNow.AddSeconds(20);
        while (ChildProcesses.Alive(solver) && DateTime.UtcNow < deadline)
        {
            Thread.Sleep(100);
        }

        Assert.False(ChildProcesses.Alive(solver), "the orphaned solver process was still running 20 s after its worker died");

        using var second = WorkerProcess.Start(Dir, new Dictionary<string, string> { ["Isolation"] = "InProcess" }, "--once", "--time", "1", "--solvers", "sa");
        Assert.True(second.WaitForExit() == 0, second.Log);
        AssertComplete(Path.Combine(Outbox, "orphan"), interrupted: false);
        Assert.Equal(2, Record(Path.Combine(Outbox, "orphan")).GetProperty("attempt").GetInt32());
        AssertNothingLeft();
    }

    private static void WaitFor(Func<bool> condition, WorkerProcess worker, string what)
    {
        var deadline = DateTime.UtcNow.AddSeconds(60);
        while (!condition())
        {
            if (DateTime.UtcNow > deadline || worker.HasExited)
            {
                Assert.Fail($"never saw {what}; the worker's log:\n{worker.Log}");
            }

            Thread.Sleep(100);
        }
    }
}
