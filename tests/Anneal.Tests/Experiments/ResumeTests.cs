using Anneal.Experiments;
using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.BenchmarkReaders;

namespace Anneal.Tests.Experiments;

public sealed class ResumeTests : TempFolderTest
{
    // 3 instances × 2 budgets × 2 seeds × 2 solvers = 24 runs, each a few hundred iterations on four stops.
    private static readonly BenchSettings Settings = new() { Solvers = ["insertion", "sa"], Seeds = 2, Budgets = [1, 2], Iterations = 300, Jobs = 1 };

    [Fact]
    public void An_interrupted_experiment_resumes_with_no_duplicated_and_no_missing_runs()
    {
        var inputs = Instances();
        string outDir = Path.Combine(Dir, "out");
        using (var stop = new CancellationTokenSource())
        {
            int seen = 0;
            var first = BenchRunner.Run(Hosting.Runner, inputs, Settings, ReferenceValues.Empty, outDir, _ =>
            {
                if (++seen == 5)
                {
                    stop.Cancel();
                }
            }, null, stop.Token);
            Assert.Equal(5, first.Finished);
            Assert.Equal(19, first.Missing);
            Assert.Equal(5, ResultsCsv.Read(Path.Combine(outDir, BenchRunner.ResultsFile)).Count);
        }

        var second = BenchRunner.Run(Hosting.Runner, inputs, Settings, ReferenceValues.Empty, outDir, null, null, CancellationToken.None);
        Assert.Equal(5, second.Skipped);
        Assert.Equal(19, second.Finished);
        Assert.Equal(0, second.Missing);

        var rows = ResultsCsv.Read(Path.Combine(outDir, BenchRunner.ResultsFile));
        var keys = rows.Select(RunKey.Of).ToList();
        Assert.Equal(24, keys.Count);
        Assert.Equal(keys.Count, keys.Distinct().Count());
        Assert.True(keys.ToHashSet().SetEquals(second.Plan.Select(RunKey.Of)));
        Assert.All(rows, r => Assert.True(File.Exists(Path.Combine(outDir, r.TraceFile)), r.TraceFile));

        // A third time there is nothing left to do.
        var third = BenchRunner.Run(Hosting.Runner, inputs, Settings, ReferenceValues.Empty, outDir, null, null, CancellationToken.None);
        Assert.Equal((24, 0), (third.Skipped, third.Finished));
    }

    [Fact]
    public void A_partial_results_file_written_by_hand_is_completed()
    {
        var inputs = Instances();
        string outDir = Path.Combine(Dir, "out");
        BenchRunner.Run(Hosting.Runner, inputs, Settings, ReferenceValues.Empty, outDir, null, null, CancellationToken.None);
        string path = Path.Combine(outDir, BenchRunner.ResultsFile);
        var all = ResultsCsv.Read(path);

        // Keep every third row, as if the experiment had stopped at random places.
        ResultsCsv.Write(path, all.Where((_, i) => i % 3 == 0));
        var again = BenchRunner.Run(Hosting.Runner, inputs, Settings, ReferenceValues.Empty, outDir, null, null, CancellationToken.None);
        Assert.Equal(8, again.Skipped);
        Assert.Equal(16, again.Finished);
        var keys = ResultsCsv.Read(path).Select(RunKey.Of).ToList();
        Assert.Equal(24, keys.Distinct().Count());
        Assert.Equal(24, keys.Count);
    }

    [Fact]
    public void A_run_cancelled_in_flight_is_not_recorded()
    {
        // A long budget cut short by cancellation: its plan is not a finished run, so nothing is written for it.
        // The stop comes from the run's own first progress point, so it always lands while the run is in flight
        // (a timer could fire before the run starts on a loaded machine, or after a fast one ends).
        var inputs = Instances().Take(1).ToList();
        var settings = new BenchSettings { Solvers = ["sa"], Seeds = 1, Budgets = [60], Jobs = 1 };
        string outDir = Path.Combine(Dir, "out");
        using var stop = new CancellationTokenSource();
        int points = 0;
        var outcome = BenchRunner.Run(Hosting.Runner, inputs, settings, ReferenceValues.Empty, outDir, null, (_, _) =>
        {
            Interlocked.Increment(ref points);
            stop.Cancel();
        }, stop.Token);
        Assert.True(points > 0, "the run reported no progress");
        Assert.Equal((0, 1, 1), (outcome.Finished, outcome.Dropped, outcome.Missing));
        Assert.Empty(ResultsCsv.Read(Path.Combine(outDir, BenchRunner.ResultsFile)));
    }

    [Fact]
    public void A_damaged_results_file_is_reported_with_its_row()
    {
        string path = Path.Combine(Dir, "results.csv");
        File.WriteAllText(path, string.Join(',', ResultsCsv.Columns) + "\nI1,sa,one,5,distance,1,1,1,true,1,1,,,,t.csv\n");
        var e = Assert.Throws<InputException>(() => ResultsCsv.Read(path));
        var problem = Assert.Single(e.Problems);
        Assert.Equal((2, "seed", "one"), (problem.Row!.Value, problem.Column!, problem.Value!));
    }

    [Fact]
    public void Lower_bounds_survive_a_rewrite_and_older_files_without_them_still_resume()
    {
        string path = Path.Combine(Dir, "results.csv");
        var bound = new BenchRow("I1", "bound", 1, 5, "distance", 0, 0, 0, false, 1.5, 5, 784, 5, null, "t.csv", 770.25, BoundOnly: true);
        var plan = new BenchRow("I1", "sa", 1, 5, "distance", 784, 5, 784, true, 2, 5, 784, 5, 0, "u.csv");
        ResultsCsv.Write(path, [bound, plan]);
        Assert.Equal([bound, plan], ResultsCsv.Read(path));

        // A results.csv from before the two columns: its rows read back without a bound.
        File.WriteAllText(path, string.Join(',', ResultsCsv.Columns[..^2]) + "\nI1,sa,1,5,distance,784,5,784,true,2,5,784,5,0,u.csv\n");
        Assert.Equal([plan], ResultsCsv.Read(path));
    }

    [Fact]
    public void Names_with_commas_quotes_and_line_breaks_are_quoted_and_read_back()
    {
        // RFC 4180 section 2, rules 6 and 7: a field holding a comma, a double quote or a line break is enclosed in
        // double quotes, and a quote inside is doubled.
        string path = Path.Combine(Dir, "results.csv");
        var row = new BenchRow("depot north\r\nday 1", "say \"hi\"", 1, 5, "distance", 784, 5, 784, true, 2, 5, 784, 5, 0, "t,1.csv");
        ResultsCsv.Write(path, [row]);
        string text = File.ReadAllText(path);
        Assert.Contains("\"depot north\r\nday 1\",\"say \"\"hi\"\"\",1,", text, StringComparison.Ordinal);
        Assert.Contains(",\"t,1.csv\",", text, StringComparison.Ordinal);
        Assert.Equal([row], ResultsCsv.Read(path));
    }

    private List<LoadedInput> Instances()
    {
        var inputs = new List<LoadedInput>();
        foreach (var name in new[] { "TINYA", "TINYB", "TINYC" })
        {
            string file = Path.Combine(Dir, name.ToLowerInvariant() + ".txt");
            File.WriteAllText(file, SampleTexts.Solomon.Replace("TINY1", name, StringComparison.Ordinal));
            inputs.Add(InputLoader.Load(file));
        }

        return inputs;
    }
}
