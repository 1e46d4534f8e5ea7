using System.Text.Json;
using Anneal.Cli;
using Anneal.Experiments;
using Anneal.Tests.Formats.Input.BenchmarkReaders;
using Anneal.Tests.Reports;

namespace Anneal.Tests.Experiments;

public sealed class BenchCommandTests : CommandTest
{
    [Fact]
    public void An_experiment_file_runs_and_leaves_results_statistics_pictures_and_summaries()
    {
        foreach (var name in new[] { "TINYA", "TINYB" })
        {
            Directory.CreateDirectory(Path.Combine(Dir, "set"));
            File.WriteAllText(Path.Combine(Dir, "set", name.ToLowerInvariant() + ".txt"), SampleTexts.Solomon.Replace("TINY1", name, StringComparison.Ordinal));
        }

        // A reference for TINYA only: TINYB's gaps are to the best found in the experiment.
        File.WriteAllText(Path.Combine(Dir, "ref.csv"), "instance,objective,value,distance_rule\nTINYA,distance-only,60,euclidean-double\n");
        File.WriteAllText(Path.Combine(Dir, "exp.json"), """
            { "instances": ["set/*.txt"], "solvers": ["insertion", "sa"], "seeds": 2, "budgets": [1, 2],
              "iterations": 200, "objective": "distance", "reference": "ref.csv", "jobs": 1, "out": "out" }
            """);

        // --seeds on the command line overrides the file's 2.
        int code = CliApp.Run(["bench", "--experiment", Path.Combine(Dir, "exp.json"), "--seeds", "1", "--throughput-seconds", "0", "--quiet"], new CliContext(Out, Err));
        Assert.True(code == 0, All);

        string outDir = Path.Combine(Dir, "out");
        var rows = ResultsCsv.Read(Path.Combine(outDir, "results.csv"));
        Assert.Equal(2 * 2 * 1 * 2, rows.Count);
        Assert.All(rows.Where(r => r.Instance == "TINYA"), r => Assert.Equal(60, r.Reference));
        foreach (var stem in new[] { "profile", "quality", "time-to-target" })
        {
            PngCheck.Valid(File.ReadAllBytes(Path.Combine(outDir, stem + ".png")), 1000, 560);
            Assert.Equal("svg", System.Xml.Linq.XDocument.Load(Path.Combine(outDir, stem + ".svg")).Root!.Name.LocalName);
        }

        string md = File.ReadAllText(Path.Combine(outDir, "summary.md"));
        Assert.Contains("| solver | budget |", md, StringComparison.Ordinal);
        Assert.Contains("best found across this experiment: TINYB (distance)", md, StringComparison.Ordinal);
        Assert.Contains("![", md, StringComparison.Ordinal);
        string html = File.ReadAllText(Path.Combine(outDir, "summary.html"));
        Assert.Equal(3, html.Split("data:image/png;base64,").Length - 1);
        Assert.Contains("<table>", html, StringComparison.Ordinal);
        Assert.EndsWith("</html>", html.TrimEnd(), StringComparison.Ordinal);

        using var machine = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "machine.json")));
        var invocation = Assert.Single(machine.RootElement.GetProperty("invocations").EnumerateArray());
        Assert.Equal(Environment.ProcessorCount, invocation.GetProperty("processorCount").GetInt32());

        var stats = File.ReadAllLines(Path.Combine(outDir, "statistics.csv"));
        Assert.Equal(1 + 4, stats.Length); // header + 2 solvers × 2 budgets
        Assert.Equal(1 + 2, File.ReadAllLines(Path.Combine(outDir, "comparisons.csv")).Length);

        // The same command again skips everything and appends a second machine entry.
        Out.GetStringBuilder().Clear();
        Assert.Equal(0, CliApp.Run(["bench", "--experiment", Path.Combine(Dir, "exp.json"), "--seeds", "1", "--throughput-seconds", "0", "--quiet"], new CliContext(Out, Err)));
        Assert.Contains("8 of 8 planned runs were already in results.csv", Out.ToString(), StringComparison.Ordinal);
        Assert.Equal(8, ResultsCsv.Read(Path.Combine(outDir, "results.csv")).Count);
    }

    [Fact]
    public void A_bad_experiment_file_names_the_key()
    {
        File.WriteAllText(Path.Combine(Dir, "exp.json"), """{ "instances": ["x"], "seeds": "three", "budget": [5] }""");
        int code = CliApp.Run(["bench", "--experiment", Path.Combine(Dir, "exp.json")], new CliContext(Out, Err));
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("seeds", Err.ToString(), StringComparison.Ordinal);
        Assert.Contains("budget", Err.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Several_budgets_parse_and_bad_ones_are_refused()
    {
        Assert.Equal([5.0, 30.0], Anneal.Cli.Commands.OptionValues.BenchBudgets("5,30")!);
        Assert.Null(Anneal.Cli.Commands.OptionValues.BenchBudgets("5,x"));
        int code = CliApp.Run(["bench", Dir, "--time", "0"], new CliContext(Out, Err));
        Assert.Equal(ExitCodes.InvalidInput, code);
    }
}
