using System.Diagnostics;
using System.IO.Compression;
using Anneal.Formats.Input;
using Anneal.Worker.Untrusted;

namespace Anneal.Tests.Worker;

/// <summary>
/// A job is plain files only, and a zip may unpack only so far (issue 19: a stops.csv linked to the password file was
/// read and its first line copied into error.txt; a 1 MB zip holding a 1 GiB entry was extracted in full). The real
/// worker refuses each such job with a clear reason and goes on serving the others.
/// </summary>
public sealed class UntrustedJobTests : WorkerTest
{
    [Fact]
    public void Links_pipes_zip_bombs_and_out_of_range_numbers_are_refused_with_a_reason_while_the_worker_keeps_serving()
    {
        Directory.CreateDirectory(Inbox);
        WriteJob("linked", files => files.Remove("stops.csv"));
        File.CreateSymbolicLink(Path.Combine(Inbox, "linked", "stops.csv"), "/etc/passwd");
        WriteJob("piped", files => files.Remove("stops.csv"));
        Assert.True(Run("mkfifo", Path.Combine(Inbox, "piped", "stops.csv")));
        WriteJob("huge-service", files => files["stops.csv"] = files["stops.csv"].Replace(",12,5,", ",12,1e308,", StringComparison.Ordinal));
        Zip("bomb.zip", zip => Padding(zip, 64 << 20));
        Zip("link.zip", zip => zip.CreateEntry("extra.csv").ExternalAttributes = 0xA1FF << 16);
        WorkerJobs.DropValid(Dir, "good", 9);

        using var worker = WorkerProcess.Start(Dir, "--once", "--time", "0.5", "--solvers", "sa");

        Assert.True(worker.WaitForExit() == 0, worker.Log);
        AssertComplete(Path.Combine(Outbox, "good"), interrupted: false);
        Assert.Equal(["bomb", "huge-service", "link", "linked", "piped"], Names(Failed));
        Assert.Contains("stops.csv: is a symbolic link; a job is plain files only", Error("linked"), StringComparison.Ordinal);
        Assert.DoesNotContain("root:", Error("linked"), StringComparison.Ordinal);
        Assert.Contains("is not a regular file (a pipe, socket or device)", Error("piped"), StringComparison.Ordinal);
        Assert.Contains("stops.csv, row 2, column 'service'", Error("huge-service"), StringComparison.Ordinal);
        Assert.Contains("outside the accepted range", Error("huge-service"), StringComparison.Ordinal);
        Assert.Contains("Worker:MaxZipRatio", Error("bomb"), StringComparison.Ordinal);
        Assert.Contains("symbolic link or another special file", Error("link"), StringComparison.Ordinal);
    }

    [Fact]
    public void A_zip_bomb_is_refused_before_anything_is_written()
    {
        string zip = Path.Combine(Dir, "bomb.zip");
        using (var archive = ZipFile.Open(zip, ZipArchiveMode.Create))
        {
            Padding(archive, 32 << 20);
        }

        string scratch = Path.Combine(Dir, "scratch");
        var e = Assert.Throws<InputException>(() => SafeUnzip.Extract(zip, scratch, "bomb.zip", UnpackLimits.Default));

        Assert.Contains("times its packed size", Assert.Single(e.Problems).Problem, StringComparison.Ordinal);
        Assert.False(Directory.Exists(scratch));
    }

    [Theory]
    [InlineData(1_000_000, 1e9, "more than 1,000,000 bytes")] // the size cap alone
    [InlineData(long.MaxValue, 2, "times its packed size")] // the ratio cap alone
    public void Each_zip_limit_is_enforced_on_its_own(long maxBytes, double maxRatio, string problem)
    {
        string zip = Path.Combine(Dir, "job.zip");
        using (var archive = ZipFile.Open(zip, ZipArchiveMode.Create))
        {
            Padding(archive, 4 << 20);
        }

        var e = Assert.Throws<InputException>(() => SafeUnzip.Extract(zip, Path.Combine(Dir, "out"), "job.zip", new UnpackLimits(maxBytes, maxRatio)));

        Assert.Contains(problem, Assert.Single(e.Problems).Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_plain_zipped_job_unpacks_within_the_limits()
    {
        string zip = Path.Combine(Dir, "job.zip");
        using (var archive = ZipFile.Open(zip, ZipArchiveMode.Create))
        {
            foreach (var (name, text) in WorkerJobs.ValidFiles(2))
            {
                using var w = new StreamWriter(archive.CreateEntry("north/" + name).Open());
                w.Write(text);
            }
        }

        SafeUnzip.Extract(zip, Path.Combine(Dir, "out"), "job.zip", UnpackLimits.Default);

        Assert.True(File.Exists(Path.Combine(Dir, "out", "north", "stops.csv")));
    }

    private void WriteJob(string name, Action<Dictionary<string, string>> change)
    {
        var files = WorkerJobs.ValidFiles(1);
        change(files);
        string folder = Path.Combine(Inbox, name);
        Directory.CreateDirectory(folder);
        foreach (var (file, text) in files)
        {
            File.WriteAllText(Path.Combine(folder, file), text);
        }
    }

    private void Zip(string name, Action<ZipArchive> fill)
    {
        string staging = Path.Combine(Dir, name);
        using (var archive = ZipFile.Open(staging, ZipArchiveMode.Create))
        {
            foreach (var (file, text) in WorkerJobs.ValidFiles(3))
            {
                using var w = new StreamWriter(archive.CreateEntry(file).Open());
                w.Write(text);
            }

            fill(archive);
        }

        File.Move(staging, Path.Combine(Inbox, name));
    }

    /// <summary>An entry of zeros: it packs about a thousand to one.</summary>
    private static void Padding(ZipArchive archive, int bytes)
    {
        using var stream = archive.CreateEntry("padding.bin").Open();
        var block = new byte[1 << 20];
        for (int written = 0; written < bytes; written += block.Length)
        {
            stream.Write(block);
        }
    }

    private string Error(string job) => File.ReadAllText(Path.Combine(Failed, job, "error.txt"));

    private static bool Run(string program, params string[] args)
    {
        using var process = Process.Start(new ProcessStartInfo(program, args) { UseShellExecute = false })!;
        process.WaitForExit();
        return process.ExitCode == 0;
    }
}
