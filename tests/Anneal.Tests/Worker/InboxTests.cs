using Anneal.Cli;
using Anneal.Tests.Fixtures;

namespace Anneal.Tests.Worker;

/// <summary>A mistyped inbox is refused rather than created and watched; a failed job's log line names its first problem.</summary>
public sealed class InboxTests : TempFolderTest
{
    [Fact]
    public void A_missing_inbox_is_refused_and_named_and_nothing_is_created()
    {
        string inbox = Path.Combine(Dir, "inbxo");
        var err = new StringWriter();

        int code = CliApp.Run(["worker", "--inbox", inbox, "--outbox", Path.Combine(Dir, "out"), "--once"], new StringWriter(), err);

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains($"the inbox {inbox} does not exist", err.ToString(), StringComparison.Ordinal);
        Assert.Contains("--create-folders", err.ToString(), StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(Dir));
    }

    [Fact]
    public void Create_folders_makes_the_missing_inbox()
    {
        string inbox = Path.Combine(Dir, "new", "inbox");
        var err = new StringWriter();

        int code = CliApp.Run(["worker", "--inbox", inbox, "--outbox", Path.Combine(Dir, "out"), "--once", "--create-folders"], new StringWriter(), err);

        Assert.True(code == ExitCodes.Success, err.ToString());
        Assert.True(Directory.Exists(inbox));
    }

    [Fact]
    public void A_failed_jobs_log_line_names_its_first_problem()
    {
        WorkerJobs.DropBadDemand(Dir, "bad-demand");

        using var worker = WorkerProcess.Start(Dir, "--once", "--time", "1", "--solvers", "insertion");
        Assert.True(worker.WaitForExit() == 0, worker.Log);

        var line = Assert.Single(worker.Log.Split('\n'), l => l.Contains("Job bad-demand has invalid input", StringComparison.Ordinal));
        Assert.Contains("the first: stops.csv, row 3, column 'demand_kg'", line, StringComparison.Ordinal);
    }
}
