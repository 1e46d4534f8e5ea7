using System.Text.Json;
using Anneal.Cli.Reporting;

namespace Anneal.Tests.Cli;

/// <summary>
/// Ctrl+C (SIGINT) and SIGTERM stop a real `anneal solve` while OR-Tools is in its native phase (building its model
/// or searching) on a 1,000-stop instance: the best plan so far is written and the exit code is 130. A second
/// signal ends the process at once. The time bounds are generous ceilings, not measurements.
/// </summary>
public sealed class SignalTests : TempFolderTest
{
    [SkippableTheory]
    [InlineData("TERM")]
    [InlineData("INT")]
    public void A_signal_during_the_native_search_writes_the_best_plan_and_exits_130(string signal)
    {
        string file = BenchmarkData.File("homberger/r1_10_1.txt");
        using var run = AnnealProcess.Start(Dir, ["solve", file, "--solvers", "ortools", "--time", "300", "--out", "out"]);

        // The construction is reported first; right after it OR-Tools builds its model and searches, both native.
        Assert.True(run.WaitForLine(line => line.Contains("ortools:", StringComparison.Ordinal) && line.Contains("construction", StringComparison.Ordinal)), run.Log);
        Thread.Sleep(1500);
        if (signal == "TERM")
        {
            run.Terminate();
        }
        else
        {
            run.Interrupt();
        }

        Assert.True(run.WaitForExit(120) == 130, run.Log);
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(Dir, "out", "summary.json")));
        var root = summary.RootElement;
        Assert.True(root.GetProperty("interrupted").GetBoolean());
        var ortools = root.GetProperty("solvers")[0];
        Assert.Equal("interrupted", ortools.GetProperty("status").GetString());
        Assert.True(root.GetProperty("plan").GetProperty("vehicles").GetInt32() > 0, "the plan so far is written");
    }

    [SkippableFact]
    public void A_second_signal_ends_the_process_at_once()
    {
        string file = BenchmarkData.File("homberger/r1_10_1.txt");
        using var run = AnnealProcess.Start(Dir, ["solve", file, "--solvers", "ortools", "--time", "300", "--out", "out"]);
        Assert.True(run.WaitForLine(line => line.Contains("ortools:", StringComparison.Ordinal)), run.Log);
        run.SendTogether("TERM", "INT");
        Assert.True(run.WaitForExit(120) == ShutdownSignals.ExitCode, run.Log);
        Assert.Contains("second signal", run.Log, StringComparison.Ordinal);
    }

    [Fact]
    public void The_first_signal_stops_and_the_second_exits()
    {
        int stops = 0, exits = 0;
        using var signals = new ShutdownSignals(() => stops++, () => exits++);
        signals.Signal();
        Assert.Equal((1, 0), (stops, exits));
        signals.Signal();
        signals.Signal();
        Assert.Equal((1, 2), (stops, exits));
    }
}
