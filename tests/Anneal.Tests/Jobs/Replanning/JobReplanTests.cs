using Anneal.Cli;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Jobs.Replanning;

/// <summary>
/// Issue 24: a job can carry its own re-plan (settings.json "replan" and its plan file in the job folder), so that
/// `solve` without --from, the folder worker and the queue re-plan it as `solve --from --now --without` does.
/// The job: 10 stops, three vans (van-1..3) from 07:00, solved once; its routes.csv becomes the job's plan.csv.
/// </summary>
public sealed class JobReplanTests : WorkerTest
{
    private string SolvedJob(string name, string settings)
    {
        string job = WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", name), 31);
        var (stdout, stderr) = (new StringWriter(), new StringWriter());
        string first = Path.Combine(Dir, "first-" + name);
        Assert.True(CliApp.Run(["solve", job, "--solvers", "sa", "--iterations", "3000", "--quiet", "--out", first], stdout, stderr) == 0, stderr.ToString());
        File.Copy(Path.Combine(first, "routes.csv"), Path.Combine(job, "plan.csv"));
        File.WriteAllText(Path.Combine(job, "settings.json"), settings);
        return job;
    }

    [Fact]
    public void Solve_re_plans_a_job_whose_settings_ask_for_it_as_with_from_now_and_without()
    {
        string job = SolvedJob("north", """{ "replan": { "now": "07:30", "without": ["van-1"] } }""");
        var (stdout, stderr) = (new StringWriter(), new StringWriter());
        string second = Path.Combine(Dir, "second");

        int code = CliApp.Run(["solve", job, "--solvers", "sa", "--iterations", "3000", "--quiet", "--out", second], stdout, stderr);

        Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, stderr.ToString());
        Assert.Contains($"Re-planned from {Path.Combine(job, "plan.csv")} at 07:30", stdout.ToString(), StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(second, "changes.csv")));

        // van-1 is taken out: after 07:30 it keeps only what it had started (status done or in-progress).
        var rows = File.ReadAllLines(Path.Combine(second, "routes.csv"));
        var header = rows[0].Split(',').ToList();
        foreach (var row in rows.Skip(1).Select(r => r.Split(',')))
        {
            if (row[header.IndexOf("vehicle")] == "van-1" && row[header.IndexOf("kind")] == "stop")
            {
                Assert.Contains(row[header.IndexOf("status")], new[] { "done", "in-progress" });
            }
        }
    }

    [Fact]
    public void A_plan_file_outside_the_job_folder_is_refused_with_the_key_named()
    {
        string job = WorkerJobs.WriteValid(Path.Combine(Dir, "jobs", "south"), 32);
        File.WriteAllText(Path.Combine(job, "settings.json"), """{ "replan": { "from": "../plan.csv", "now": "25:99" } }""");
        var (stdout, stderr) = (new StringWriter(), new StringWriter());

        Assert.Equal(ExitCodes.InvalidInput, CliApp.Run(["check", job], stdout, stderr));
        string said = stdout.ToString() + stderr.ToString();
        Assert.Contains("replan.from", said, StringComparison.Ordinal);
        Assert.Contains("not the name of a file in the job folder", said, StringComparison.Ordinal);
        Assert.Contains("replan.now", said, StringComparison.Ordinal);
    }

    [Fact]
    public void The_worker_re_plans_a_job_that_carries_its_plan_and_writes_its_changes()
    {
        string job = SolvedJob("east", """{ "replan": { "now": "07:30", "without": ["van-2"] }, "solvers": ["sa"], "timeSeconds": 2 }""");
        Directory.CreateDirectory(Inbox);
        Directory.Move(job, Path.Combine(Inbox, "east"));

        using var worker = WorkerProcess.Start(Dir, "--once");
        Assert.True(worker.WaitForExit() == 0, worker.Log);

        string published = Path.Combine(Outbox, "east");
        Assert.True(File.Exists(Path.Combine(published, "changes.csv")), worker.Log);
        var changes = Json(Path.Combine(published, "summary.json")).GetProperty("changes");
        Assert.Equal("07:30", changes.GetProperty("now").GetString());
        Assert.Equal("van-2", Assert.Single(changes.GetProperty("without").EnumerateArray()).GetString());
    }
}
