using System.Diagnostics;
using System.Text;

namespace Anneal.Tests.Worker;

/// <summary>
/// Half-copied jobs (issue 19): the settle check watched only the job folder's time stamp, so a stops.csv still being
/// written was claimed with 5 of its 15 stops and published as solved. Now every file's size and time must hold for
/// the settle time and no process may have a file of the job open for writing; or the job folder holds the ready
/// marker. Checked with the real worker and real copies (cp -r, rsync).
/// </summary>
public sealed class ArrivalTests : WorkerTest
{
    private static readonly Dictionary<string, string> SettleOne = new() { ["SettleSeconds"] = "1" };

    [Fact]
    public void A_stops_file_still_open_for_writing_is_not_claimed_however_long_its_writer_pauses()
    {
        Directory.CreateDirectory(Inbox);
        var files = WorkerJobs.ValidFiles(3);
        string job = Path.Combine(Inbox, "slow");
        Directory.CreateDirectory(job);
        File.WriteAllText(Path.Combine(job, "depots.csv"), files["depots.csv"]);
        File.WriteAllText(Path.Combine(job, "vehicles.csv"), files["vehicles.csv"]);
        var stops = files["stops.csv"].Split('\n');

        using var worker = WorkerProcess.Start(Dir, SettleOne, "--once", "--time", "0.5", "--solvers", "sa");
        using (var writer = new StreamWriter(Path.Combine(job, "stops.csv")))
        {
            // Like scp on a stalled line: half the file, then nothing for three times the settle time, the file open.
            writer.Write(string.Join('\n', stops[..6]) + "\n");
            writer.Flush();
            Thread.Sleep(3000);
            writer.Write(string.Join('\n', stops[6..]));
        }

        Assert.True(worker.WaitForExit() == 0, worker.Log);
        Assert.Equal(10, ServedStops(Path.Combine(Outbox, "slow")));
    }

    [Fact]
    public void Jobs_copied_in_with_cp_r_while_the_worker_runs_are_solved_complete()
    {
        // Big files (a long note column) so that each copy takes a while and the worker polls during it.
        var sources = new List<string>();
        for (int k = 0; k < 2; k++)
        {
            sources.Add(WriteJob(Path.Combine(Dir, "source", $"copy-{k}"), seed: 40 + k, padding: 1_000_000));
        }

        using var worker = WorkerProcess.Start(Dir, new Dictionary<string, string> { ["SettleSeconds"] = "1", ["PollSeconds"] = "0.05" }, "--time", "0.5", "--solvers", "sa");
        Directory.CreateDirectory(Inbox);
        foreach (var source in sources)
        {
            Run("cp", "-r", source, Inbox + "/");
        }

        WaitFor(() => sources.All(s => File.Exists(Path.Combine(Outbox, Path.GetFileName(s), "summary.json"))), worker);
        worker.Terminate();
        worker.WaitForExit();
        foreach (var source in sources)
        {
            Assert.Equal(10, ServedStops(Path.Combine(Outbox, Path.GetFileName(source))));
        }

        Assert.Empty(Names(Failed));
    }

    [SkippableFact]
    public void A_job_copied_in_with_rsync_at_a_slow_rate_is_solved_complete()
    {
        Skip.If(!OnPath("rsync"), "rsync is not installed (.ci/run installs it)");
        string source = WriteJob(Path.Combine(Dir, "source", "synced"), seed: 50, padding: 300_000);

        using var worker = WorkerProcess.Start(Dir, SettleOne, "--once", "--time", "0.5", "--solvers", "sa");
        Directory.CreateDirectory(Inbox);

        // About 300 KB at 100 KB/s: rsync writes each file as .name.XXXXXX and renames it when complete.
        Run("rsync", "-r", "--bwlimit=100", source, Inbox + "/");

        Assert.True(worker.WaitForExit() == 0, worker.Log);
        Assert.Equal(10, ServedStops(Path.Combine(Outbox, "synced")));
    }

    [Fact]
    public void With_RequireReadyMarker_a_folder_waits_for_its_marker()
    {
        WorkerJobs.DropValid(Dir, "marked", 5);
        File.WriteAllText(Path.Combine(Inbox, "marked", ".ready"), string.Empty);
        WorkerJobs.DropValid(Dir, "unmarked", 6);
        var settings = new Dictionary<string, string> { ["RequireReadyMarker"] = "true", ["SettleSeconds"] = "60" };

        using var worker = WorkerProcess.Start(Dir, settings, "--time", "0.5", "--solvers", "sa");

        // The marker skips the (here very long) settle time; the unmarked job is not touched.
        WaitFor(() => File.Exists(Path.Combine(Outbox, "marked", "summary.json")), worker);
        Assert.True(Directory.Exists(Path.Combine(Inbox, "unmarked")));
        File.WriteAllText(Path.Combine(Inbox, "unmarked", ".ready"), string.Empty);
        WaitFor(() => File.Exists(Path.Combine(Outbox, "unmarked", "summary.json")), worker);
        worker.Terminate();
        worker.WaitForExit();
    }

    private static string WriteJob(string folder, int seed, int padding)
    {
        Directory.CreateDirectory(folder);
        var files = WorkerJobs.ValidFiles(seed);
        var lines = files["stops.csv"].TrimEnd('\n').Split('\n');
        var stops = new StringBuilder(lines[0] + ",note\n");
        string note = new('x', padding / (lines.Length - 1));
        foreach (var line in lines[1..])
        {
            stops.Append(line).Append(',').Append(note).Append('\n');
        }

        files["stops.csv"] = stops.ToString();
        foreach (var (name, text) in files)
        {
            File.WriteAllText(Path.Combine(folder, name), text);
        }

        return folder;
    }

    /// <summary>Distinct stops (S01 … S10) on the published plan's routes.</summary>
    private static int ServedStops(string folder)
    {
        Assert.True(File.Exists(Path.Combine(folder, "routes.csv")), $"no routes.csv in {folder}");
        var lines = File.ReadAllLines(Path.Combine(folder, "routes.csv"));
        int column = Array.IndexOf(lines[0].Split(','), "stop");
        return lines.Skip(1).Select(l => l.Split(',')[column]).Where(s => s.Length == 3 && s[0] == 'S').Distinct().Count();
    }

    private static void WaitFor(Func<bool> done, WorkerProcess worker)
    {
        var deadline = DateTime.UtcNow.AddSeconds(60);
        while (!done())
        {
            if (DateTime.UtcNow > deadline)
            {
                Assert.Fail("the worker did not finish in time; its log:\n" + worker.Log);
            }

            Thread.Sleep(100);
        }
    }

    private static void Run(string program, params string[] args)
    {
        using var process = Process.Start(new ProcessStartInfo(program, args) { RedirectStandardError = true, UseShellExecute = false })!;
        string err = process.StandardError.ReadToEnd();
        process.WaitForExit();
        Assert.True(process.ExitCode == 0, $"{program} failed: {err}");
    }

    private static bool OnPath(string program) =>
        (Environment.GetEnvironmentVariable("PATH") ?? string.Empty).Split(':').Any(d => File.Exists(Path.Combine(d, program)));
}
