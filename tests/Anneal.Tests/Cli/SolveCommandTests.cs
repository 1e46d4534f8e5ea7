using System.Text.Json;
using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Formats.Output;

namespace Anneal.Tests.Cli;

public sealed class SolveCommandTests : CommandTest
{
    private CliContext Context(CancellationToken cancel = default) => new(Out, Err)
    {
        Cancel = cancel,
        WorkingDirectory = Dir,
        Now = () => new DateTime(2026, 3, 4, 5, 6, 7),
    };

    // Every stop optional: whatever the placeholder or real insertion returns, the plan breaks no hard rule.
    private static SolveRequest Quick(string? outDir = null) => new() { Solvers = "insertion", TimeSeconds = 1, Iterations = 1000, OutDir = outDir, Quiet = true };

    [Fact]
    public void Writes_routes_summary_and_trace_into_the_default_folder()
    {
        int code = SolveCommand.Execute(TinyJob.Loaded(TinyJob.Create(optional: true)), Quick(), Context());

        Assert.Equal(ExitCodes.Success, code);
        string folder = Path.Combine(Dir, "runs", "tiny-job-20260304-050607");
        foreach (var file in new[] { "routes.csv", "summary.json", "trace.csv" })
        {
            Assert.True(File.Exists(Path.Combine(folder, file)), file);
        }

        Assert.Contains(folder, Out.ToString(), StringComparison.Ordinal);
        Assert.Contains("Chosen: insertion", Out.ToString(), StringComparison.Ordinal);
        Assert.Contains(Cautions.All[0], Out.ToString(), StringComparison.Ordinal);
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "summary.json")));
        Assert.Equal("insertion", summary.RootElement.GetProperty("chosen").GetString());
        Assert.Equal(1, summary.RootElement.GetProperty("seed").GetInt32());
        Assert.False(summary.RootElement.GetProperty("interrupted").GetBoolean());
    }

    [Fact]
    public void A_cancelled_run_still_writes_its_plan_and_exits_130()
    {
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();
        string outDir = Path.Combine(Dir, "stopped");

        int code = SolveCommand.Execute(TinyJob.Loaded(TinyJob.Create(optional: true)), Quick(outDir), Context(cancel.Token));

        Assert.Equal(ExitCodes.Interrupted, code);
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "summary.json")));
        Assert.True(summary.RootElement.GetProperty("interrupted").GetBoolean());
        Assert.True(File.Exists(Path.Combine(outDir, "routes.csv")));
    }

    [Fact]
    public void An_unknown_solver_exits_2_and_lists_the_known_ones()
    {
        int code = SolveCommand.Execute(TinyJob.Loaded(TinyJob.Create()), Quick() with { Solvers = "insertion,warp-drive" }, Context());

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("warp-drive", Err.ToString(), StringComparison.Ordinal);
        Assert.Contains("insertion", Err.ToString(), StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(Dir, "runs")));
    }

    [Fact]
    public void AnOutput_folder_that_cannot_be_made_is_anOutputError_naming_it()
    {
        string blocker = Path.Combine(Dir, "a-file");
        File.WriteAllText(blocker, "not a folder");
        string outDir = Path.Combine(blocker, "run");

        var e = Assert.Throws<OutputException>(() => SolveCommand.Execute(TinyJob.Loaded(TinyJob.Create(optional: true)), Quick(outDir), Context()));

        Assert.Equal(outDir, e.Path);
    }

    [Fact]
    public void Command_line_solvers_override_the_job_and_duplicates_collapse()
    {
        var names = Hosting.Catalog.Resolve("insertion, INSERTION", ["nope"], TinyJob.Create());

        Assert.Equal(["insertion"], names);
    }
}
