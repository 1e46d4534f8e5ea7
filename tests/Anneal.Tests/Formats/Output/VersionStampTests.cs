using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Anneal.Cli;
using Anneal.Formats.Output;
using Anneal.Tests.Fixtures;
using Anneal.Tests.Formats.Input.Csv;

namespace Anneal.Tests.Formats.Output;

/// <summary>Every output says what made it (version and commit), and JSON files keep non-ASCII text as UTF-8.</summary>
public sealed class VersionStampTests : CommandTest
{
    [Fact]
    public void Version_prints_the_version_and_the_commit()
    {
        Assert.Equal(ExitCodes.Success, CliApp.Run(["--version"], Out, Err));

        var match = Regex.Match(Out.ToString().Trim(), @"^(?<version>\d+\.\d+\.\d+) \(commit (?<commit>[0-9a-f]{7,40}|unknown)\)$");
        Assert.True(match.Success, Out.ToString());
        Assert.Equal((ToolVersion.Version, ToolVersion.Commit), (match.Groups["version"].Value, match.Groups["commit"].Value));
    }

    [Fact]
    public void Summary_and_run_json_carry_the_version_and_commit_and_write_accents_as_utf8()
    {
        var files = JobFolder.ValidPlanar();
        files.Remove("settings.json");
        files["depots.csv"] = "id,x,y\nFennick Wharf — Café Süd,0,0\n";
        files["vehicles.csv"] = files["vehicles.csv"].Replace(",hub,", ",Fennick Wharf — Café Süd,", StringComparison.Ordinal);
        using var job = new JobFolder(files, "Brückenhof–Nord");
        string run = Path.Combine(Dir, "run");

        int code = CliApp.Run(["solve", job.Path, "--solvers", "insertion", "--time", "2", "--out", run, "--quiet"], Out, Err);
        Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, Err.ToString());

        foreach (var file in new[] { "summary.json", "run.json" })
        {
            byte[] bytes = File.ReadAllBytes(Path.Combine(run, file));
            string text = new UTF8Encoding(false, true).GetString(bytes);
            Assert.DoesNotContain("\\u", text, StringComparison.Ordinal);
            using var json = JsonDocument.Parse(bytes);
            Assert.Equal(ToolVersion.Version, json.RootElement.GetProperty("annealVersion").GetString());
            Assert.Equal(ToolVersion.Commit, json.RootElement.GetProperty("commit").GetString());
            Assert.Contains("Brückenhof–Nord", text, StringComparison.Ordinal); // the instance name, and run.json's input path
        }

        string summary = File.ReadAllText(Path.Combine(run, "summary.json"));
        Assert.Contains("\"instance\": \"Brückenhof–Nord\"", summary, StringComparison.Ordinal);
    }

    [Fact]
    public void The_bench_machine_file_records_the_version_and_commit()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());
        string bench = Path.Combine(Dir, "bench");

        int code = CliApp.Run(["bench", job.Path, "--solvers", "insertion", "--seeds", "1", "--time", "0.5", "--throughput-seconds", "0", "--out", bench, "--quiet"], Out, Err);
        Assert.True(code == ExitCodes.Success, Err.ToString());

        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(bench, "machine.json")));
        var invocation = json.RootElement.GetProperty("invocations")[0];
        Assert.Equal(ToolVersion.Version, invocation.GetProperty("annealVersion").GetString());
        Assert.Equal(ToolVersion.Commit, invocation.GetProperty("commit").GetString());
    }

    [Fact]
    public void The_worker_status_file_records_the_version_and_commit()
    {
        string path = Path.Combine(Dir, "w1" + Anneal.Worker.StatusFile.Extension);
        var now = new DateTimeOffset(2026, 12, 3, 6, 0, 0, TimeSpan.Zero);
        new Anneal.Worker.StatusFile(path, "w1", now).Write("running", now);

        using var json = JsonDocument.Parse(File.ReadAllBytes(path));
        Assert.Equal(ToolVersion.Version, json.RootElement.GetProperty("annealVersion").GetString());
        Assert.Equal(ToolVersion.Commit, json.RootElement.GetProperty("commit").GetString());
    }
}
