using System.Diagnostics;
using Anneal.Cli;
using Anneal.Formats.Output.Artifacts;
using Anneal.Jobs;
using Anneal.Tests.Formats.Input.Csv;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Tests.Cli;

/// <summary>
/// `solve` on a full disk: a plain message that says so (no stack trace), exit 4 (README's exit codes), and no file of
/// the run left in its folder (no routes.csv without its summary).
/// </summary>
public sealed class DiskFullTests : CommandTest
{
    // errno 28 on Linux; .NET keeps the errno as the HResult of the IOException it raises.
    private const int NoSpace = 28;

    [Fact]
    public void A_full_disk_while_writing_exits_4_with_a_plain_message_and_leaves_no_file_of_the_run()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());
        string outDir = Path.Combine(Dir, "run");
        var services = new ServiceCollection().AddAnnealHost();
        services.AddSingleton<IRunArtifact, FillsTheDisk>(); // after every real writer: they have all written by then
        using var provider = services.BuildServiceProvider();

        int code = CliApp.Run(["solve", job.Path, "--solvers", "sa", "--iterations", "200", "--quiet", "--out", outDir], new CliContext(Out, Err) { Services = provider });

        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("the disk is full", Err.ToString(), StringComparison.Ordinal);
        Assert.Contains($"cannot write {Path.Combine(outDir, "big.bin")}: the disk is full", Err.ToString(), StringComparison.Ordinal);
        Assert.Contains("nothing of this run was kept in " + outDir, Err.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", All, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(outDir));
    }

    [SkippableFact]
    public void A_real_full_file_system_gives_the_same_exit_and_no_file_of_the_run()
    {
        // A 1 MiB tmpfs filled up to its last 12 KiB: routes.csv fits, the pictures do not. Needs root (CI runs as root).
        string mount = Path.Combine(Dir, "small");
        Directory.CreateDirectory(mount);
        Skip.IfNot(Run("mount", "-t", "tmpfs", "-o", "size=1m", "tmpfs", mount) == 0, "mounting a tmpfs needs root");
        try
        {
            using (var filler = File.Create(Path.Combine(mount, "filler")))
            {
                var block = new byte[4096];
                long free = new DriveInfo(mount).AvailableFreeSpace;
                for (long n = 0; n < free - 12 * 1024; n += block.Length)
                {
                    filler.Write(block);
                }
            }

            using var job = new JobFolder(JobFolder.ValidPlanar());
            string outDir = Path.Combine(mount, "run");
            int code = CliApp.Run(["solve", job.Path, "--solvers", "sa", "--iterations", "200", "--quiet", "--out", outDir], Out, Err);

            Assert.Equal(ExitCodes.OutputFailed, code);
            Assert.Contains("the disk is full", Err.ToString(), StringComparison.Ordinal);
            Assert.DoesNotContain("   at ", All, StringComparison.Ordinal);
            Assert.Empty(Directory.GetFileSystemEntries(outDir));
        }
        finally
        {
            Run("umount", mount);
        }
    }

    private static int Run(string file, params string[] args)
    {
        try
        {
            using var p = Process.Start(new ProcessStartInfo(file, args) { RedirectStandardError = true, RedirectStandardOutput = true })!;
            p.WaitForExit();
            return p.ExitCode;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return -1;
        }
    }

    /// <summary>Writes half a file and then finds no space left, as a disk that fills up during the run does.</summary>
    private sealed class FillsTheDisk : IRunArtifact
    {
        public void Write(RunContext run) =>
            Anneal.Formats.Output.AtomicFile.Write(run.PathOf("big.bin"), stream =>
            {
                stream.Write("half"u8);
                throw new IOException("No space left on device", NoSpace);
            });
    }
}
