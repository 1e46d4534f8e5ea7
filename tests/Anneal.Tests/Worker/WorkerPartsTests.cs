using Anneal.Cli;
using Anneal.Worker;

namespace Anneal.Tests.Worker;

/// <summary>The worker's small parts in-process: entry names, the dead-or-alive lock, start-up validation.</summary>
public sealed class WorkerPartsTests : TempFolderTest
{
    [Theory]
    [InlineData("depot-north", true, "depot-north", 0, "")]
    [InlineData("depot-north~r2", true, "depot-north", 2, "")]
    [InlineData("c101.txt", false, "c101", 0, ".txt")]
    [InlineData("week 12~r1.zip", false, "week 12", 1, ".zip")]
    [InlineData("odd~rx", true, "odd~rx", 0, "")]
    public void Entry_names_carry_the_retry_count(string name, bool folder, string job, int retries, string extension)
    {
        var entry = JobEntry.Parse(name, folder);
        Assert.Equal((job, retries, extension), (entry.Job, entry.Retries, entry.Extension));
        Assert.Equal(name, entry.Name);
        Assert.Equal(job + extension, entry.OriginalName);
        Assert.Equal(entry with { Retries = 3 }, JobEntry.Parse(entry.WithRetries(3).Name, folder));
    }

    [Fact]
    public void A_held_lock_cannot_be_taken_and_a_released_one_is_gone()
    {
        string path = Path.Combine(Dir, "w.lock");
        using (WorkerLock.Create(path, "test"))
        {
            Assert.Null(WorkerLock.TryTake(path));
        }

        Assert.False(File.Exists(path));
        Assert.Null(WorkerLock.TryTake(path));
    }

    [Fact]
    public void A_dead_workers_lock_can_be_taken()
    {
        // A lock file nobody holds is what a killed worker leaves behind (the kernel dropped its lock).
        string path = Path.Combine(Dir, "dead.lock");
        File.WriteAllText(path, "worker dead");
        using var taken = WorkerLock.TryTake(path);
        Assert.NotNull(taken);
    }

    [Fact]
    public void A_zipped_job_folder_is_unpacked_beside_the_claim_and_its_folder_found()
    {
        string job = Path.Combine(Dir, "src", "week-12");
        Directory.CreateDirectory(job);
        File.WriteAllText(Path.Combine(job, "stops.csv"), "id\n");
        string zip = Path.Combine(Dir, "week-12.zip");
        System.IO.Compression.ZipFile.CreateFromDirectory(job, zip, System.IO.Compression.CompressionLevel.Fastest, includeBaseDirectory: true);

        var claimed = new ClaimedJob(JobEntry.Parse("week-12.zip", isFolder: false), zip, DateTimeOffset.UnixEpoch);
        string found = JobInput.Locate(claimed);
        Assert.Equal(Path.Combine(JobInput.ScratchFor(claimed), "week-12"), found);
        Assert.True(File.Exists(Path.Combine(found, "stops.csv")));
    }

    [Fact]
    public void Publishing_replaces_an_interrupted_plan_but_never_a_final_one()
    {
        var record = new JobRecord("north", "north", "w", 1, DateTimeOffset.UnixEpoch, DateTimeOffset.UnixEpoch, Interrupted: true, Final: false);
        string first = Publisher.NewPartial(Dir, "w", "north");
        record.Write(first);
        Assert.Equal(Path.Combine(Dir, "north"), Publisher.Publish(first, Dir, "north", "w"));

        string second = Publisher.NewPartial(Dir, "w", "north");
        (record with { Interrupted = false, Final = true }).Write(second);
        Assert.Equal(Path.Combine(Dir, "north"), Publisher.Publish(second, Dir, "north", "w"));
        Assert.True(JobRecord.TryRead(Path.Combine(Dir, "north"))!.Final);

        // Another job of the same name keeps the final result and takes the next free name.
        string third = Publisher.NewPartial(Dir, "w", "north");
        Assert.Equal(Path.Combine(Dir, "north-2"), Publisher.Publish(third, Dir, "north", "w"));
        Assert.Equal(["north", "north-2"], Directory.GetDirectories(Dir).Select(d => Path.GetFileName(d)).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Settings_are_checked_at_start_up_and_every_problem_is_named()
    {
        var err = new StringWriter();
        int code = CliApp.Run(["worker", "--outbox", Path.Combine(Dir, "out"), "--jobs", "0", "--time", "-1", "--solvers", "sa,nosuch"], new StringWriter(), err);
        Assert.Equal(ExitCodes.InvalidInput, code);
        string text = err.ToString();
        Assert.Contains("the inbox folder is not set", text, StringComparison.Ordinal);
        Assert.Contains("ConcurrentJobs", text, StringComparison.Ordinal);
        Assert.Contains("TimeSeconds", text, StringComparison.Ordinal);
        Assert.Contains("'nosuch'", text, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(Dir, "out")));
    }
}
