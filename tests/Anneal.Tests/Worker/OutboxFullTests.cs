using System.Diagnostics;

namespace Anneal.Tests.Worker;

/// <summary>
/// A full disk is the machine's fault, not the job's (issue 19: with the outbox full every attempt failed at once, both
/// jobs were given up after 3 attempts in 6 s, six .partial-* folders stayed and --once exited 0). Tested for real: the
/// outbox is a small tmpfs, filled to the last byte, so the worker's writes fail with the kernel's ENOSPC. Needs root
/// (to mount); skipped otherwise.
/// </summary>
public sealed class OutboxFullTests : WorkerTest
{
    [SkippableFact]
    public void A_full_outbox_counts_no_attempt_leaves_no_partial_folder_and_once_exits_4_then_the_job_is_solved_once_there_is_room()
    {
        Directory.CreateDirectory(Outbox);
        Skip.IfNot(Mount(Outbox), "cannot mount a tmpfs here (needs root)");
        try
        {
            Fill(Outbox);
            WorkerJobs.DropValid(Dir, "north", 4);

            using (var worker = WorkerProcess.Start(Dir, "--once", "--time", "0.5", "--solvers", "sa"))
            {
                Assert.True(worker.WaitForExit() == 4, worker.Log);
                Assert.Contains("no space left", worker.Log, StringComparison.OrdinalIgnoreCase);
            }

            // Back as it was: no retry mark, nothing half-written anywhere, nothing in failed/.
            Assert.Equal(["north"], Names(Inbox));
            Assert.Empty(Directory.GetDirectories(Outbox));
            Assert.Empty(Names(Failed));

            File.Delete(Path.Combine(Outbox, "filler"));
            using (var worker = WorkerProcess.Start(Dir, "--once", "--time", "0.5", "--solvers", "sa"))
            {
                Assert.True(worker.WaitForExit() == 0, worker.Log);
            }

            AssertComplete(Path.Combine(Outbox, "north"), interrupted: false);
            Assert.Equal(1, Record(Path.Combine(Outbox, "north")).GetProperty("attempt").GetInt32());
            AssertNothingLeft();
        }
        finally
        {
            Run("umount", Outbox);
        }
    }

    private static bool Mount(string folder) =>
        OperatingSystem.IsLinux() && Environment.UserName == "root" && Run("mount", "-t", "tmpfs", "-o", "size=16m", "tmpfs", folder);

    /// <summary>Writes one file until the file system refuses with ENOSPC, in ever smaller pieces down to one byte.</summary>
    private static void Fill(string folder)
    {
        using var stream = new FileStream(Path.Combine(folder, "filler"), FileMode.Create, FileAccess.Write, FileShare.None, bufferSize: 1);
        foreach (int size in new[] { 1 << 16, 1 << 12, 1 })
        {
            var block = new byte[size];
            try
            {
                while (true)
                {
                    stream.Write(block);
                }
            }
            catch (IOException e) when (e.HResult == 28)
            {
                // full at this size; try smaller pieces
            }
        }
    }

    private static bool Run(string program, params string[] args)
    {
        try
        {
            using var process = Process.Start(new ProcessStartInfo(program, args) { RedirectStandardError = true, UseShellExecute = false })!;
            process.StandardError.ReadToEnd();
            process.WaitForExit();
            return process.ExitCode == 0;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return false;
        }
    }
}
