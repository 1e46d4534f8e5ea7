using System.Diagnostics;
using System.Text;
using Anneal.Cli;
using Anneal.Tests.Formats.Input.BenchmarkReaders;
using Anneal.Tests.Formats.Input.Csv;
using CsCheck;
using Xunit.Abstractions;

namespace Anneal.Tests.Cli;

/// <summary>
/// Issue 19's harness: each mutant goes through `anneal check`; one that check calls valid is then solved briefly by
/// the default solvers and OR-Tools and CP-SAT in a child `anneal solve` process, so that a native abort is seen as
/// the child's signal instead of ending the test host. Each solve is classified: solved, clean refusal, crash (a
/// signal, exit 1, a stack trace) or hang (alive past its budget and 30 s). Any crash or hang fails the test, and so
/// does a check that crashes. Every mutant is checked; the solves are a sample (the first distinct valid mutants):
/// `ANNEAL_FUZZ_CASES` sets the mutants per reader and `ANNEAL_FUZZ_SOLVES` the solves per reader for a long run.
/// </summary>
public sealed class CheckThenSolveFuzzTests(ITestOutputHelper output) : IDisposable
{
    private const double SolveSeconds = 1;

    /// <summary>A solve still running this long after it started counts as hung (its budget plus a generous start-up).</summary>
    private const double HangSeconds = SolveSeconds + 30;

    /// <summary>
    /// Values at the edges of the ranges `check` accepts (README, "Accepted ranges": coordinates, times of the job's
    /// two days, services, quantities, prices): inside a range but large is where integer scaling for native code
    /// has failed before (issue 19), so the mutants aim there.
    /// </summary>
    private static readonly string[] Edges =
    [
        "20000", "-20000", "19999.999", "2880", "48:00", "47:59", "1440", "24:00", "1e9", "999999999", "1000000", "1e6", "300", "0.000001", "0", "-0",
        "00:00", "1e-300", "10", "9999999", "1e7", "-1e7", "40000", "604800", "4.9e-324",
    ];

    private readonly string _dir = Directory.CreateTempSubdirectory("anneal-fuzz-").FullName;

    public void Dispose()
    {
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temporary folder is not the test's result.
        }
    }

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Csv_jobs_that_check_accepts_solve_without_a_crash_or_a_hang()
    {
        var tally = new Tally("CSV job");
        Gen.Select(CsvJobFuzzTests.Mutation.Array[1, 3], Gen.Int[0, 2], Gen.Int[0, 400], Gen.Int[0, 400]).Array[FuzzBudget.Cases(60)].Sample(cases =>
        {
            string job = Path.Combine(_dir, "job");
            foreach (var (mutations, edge, a, b) in cases)
            {
                var files = CsvJobFuzzTests.Base();
                foreach (var m in mutations)
                {
                    CsvJobFuzzTests.Apply(files, m);
                }

                if (edge == 0)
                {
                    Edge(files, a, b);
                }

                if (Directory.Exists(job))
                {
                    Directory.Delete(job, recursive: true);
                }

                Directory.CreateDirectory(job);
                var content = new StringBuilder();
                foreach (var (name, bytes) in files)
                {
                    File.WriteAllBytes(Path.Combine(job, name), bytes);
                    content.Append(name).Append('\0').Append(Encoding.UTF8.GetString(bytes)).Append('\0');
                }

                tally.Try(job, content.ToString(), this);
            }
        }, iter: 1, threads: 1, seed: "0N0XIzNsQ0O2");
        tally.Finish(output);
    }

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Solomon_files_that_check_accepts_solve_without_a_crash_or_a_hang() => Texts("Solomon", SampleTexts.Solomon, "fuzz.txt", "d7zz9J9Ua6Y1");

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Cvrplib_files_that_check_accepts_solve_without_a_crash_or_a_hang() => Texts("CVRPLIB", SampleTexts.Cvrplib, "fuzz.vrp", "4a3dFhhvcWPm");

    private void Texts(string reader, string sample, string fileName, string seed)
    {
        var tally = new Tally(reader);
        Gen.Select(TextMutation.Several, Gen.Int[0, 2], Gen.Int[0, 1000], Gen.Int[0, 1000]).Array[FuzzBudget.Cases(60)].Sample(cases =>
        {
            string file = Path.Combine(_dir, fileName);
            foreach (var (mutations, edge, a, b) in cases)
            {
                string text = TextMutation.Apply(sample, mutations);
                if (edge == 0)
                {
                    text = EdgeToken(text, a, b);
                }

                File.WriteAllText(file, text);
                tally.Try(file, text, this);
            }
        }, iter: 1, threads: 1, seed: seed);
        tally.Finish(output);
    }

    /// <summary>One cell of one CSV file (or one number of settings.json) becomes an edge value.</summary>
    private static void Edge(Dictionary<string, byte[]> files, int a, int b)
    {
        var name = CsvJobFuzzTests.Files[a % CsvJobFuzzTests.Files.Length];
        if (!files.TryGetValue(name, out var bytes))
        {
            return;
        }

        var lines = Encoding.UTF8.GetString(bytes).Split('\n');
        int row = 1 + (b % Math.Max(1, lines.Length - 1));
        if (row >= lines.Length)
        {
            return;
        }

        if (name == "settings.json")
        {
            // Any number on the line.
            lines[row] = System.Text.RegularExpressions.Regex.Replace(lines[row], @"\d+(\.\d+)?", Edges[b % Edges.Length]);
        }
        else
        {
            var cells = lines[row].Split(',');
            cells[a % cells.Length] = Edges[b % Edges.Length];
            lines[row] = string.Join(',', cells);
        }

        files[name] = Encoding.UTF8.GetBytes(string.Join('\n', lines));
    }

    private static string EdgeToken(string text, int a, int b)
    {
        var lines = text.Split('\n');
        int i = a % lines.Length;
        var tokens = lines[i].Split(' ', StringSplitOptions.RemoveEmptyEntries);
        if (tokens.Length == 0)
        {
            return text;
        }

        tokens[b % tokens.Length] = Edges[(a + b) % Edges.Length];
        lines[i] = string.Join(' ', tokens);
        return string.Join('\n', lines);
    }

    private static int Solves(int suite) =>
        int.TryParse(Environment.GetEnvironmentVariable("ANNEAL_FUZZ_SOLVES"), System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int n) && n >= 0
            ? n
            : suite;

    /// <summary>`anneal check` in this process: it calls no native code.</summary>
    private static (int Code, string Text) Check(string path)
    {
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = CliApp.Run(["check", path], stdout, stderr);
        return (code, stdout.ToString() + stderr.ToString());
    }

    /// <summary>`anneal solve` in a child process: sa, tabu, OR-Tools and CP-SAT side by side for <see cref="SolveSeconds"/>.</summary>
    private (string Verdict, string Detail) Solve(string path)
    {
        string outDir = Path.Combine(_dir, "run");
        if (Directory.Exists(outDir))
        {
            Directory.Delete(outDir, recursive: true);
        }

        var info = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var arg in new[] { Path.Combine(AppContext.BaseDirectory, "anneal.dll"), "solve", path, "--solvers", "sa,tabu,ortools,exact", "--time", "1", "--quiet", "--out", outDir })
        {
            info.ArgumentList.Add(arg);
        }

        using var process = Process.Start(info)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromSeconds(HangSeconds)))
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
            return ("hang", $"still running {HangSeconds} s after it started");
        }

        process.WaitForExit();
        string text = stdout.Result + stderr.Result;
        int code = process.ExitCode;
        if (code > 128 && code != ExitCodes.Interrupted)
        {
            return ("crash", $"ended with signal {code - 128}: {Last(text)}");
        }

        if (code == ExitCodes.InternalError || text.Contains("   at ", StringComparison.Ordinal) || text.Contains("Unhandled exception", StringComparison.Ordinal))
        {
            return ("crash", $"exit {code}: {Last(text)}");
        }

        if (code is ExitCodes.Success or ExitCodes.Infeasible)
        {
            return File.Exists(Path.Combine(outDir, "routes.csv")) && File.Exists(Path.Combine(outDir, "summary.json"))
                ? ("solved", string.Empty)
                : ("crash", $"exit {code} but routes.csv or summary.json is missing: {Last(text)}");
        }

        return code == ExitCodes.InvalidInput ? ("refused", Last(text)) : ("crash", $"exit {code}: {Last(text)}");
    }

    private static string Last(string text) => text.Length <= 600 ? text : text[^600..];

    private sealed class Tally(string reader)
    {
        private readonly HashSet<string> _solved = [];
        private readonly List<string> _failures = [];
        private readonly Dictionary<string, int> _counts = [];
        private readonly Stopwatch _clock = Stopwatch.StartNew();
        private readonly int _solves = Solves(1);
        private double _solveSeconds;

        public void Try(string path, string content, CheckThenSolveFuzzTests test)
        {
            var (code, text) = Check(path);
            Count("checked");
            if (code == ExitCodes.InvalidInput)
            {
                Count("refused by check");
                if (text.Contains("   at ", StringComparison.Ordinal) || text.Trim().Length == 0)
                {
                    _failures.Add($"check refused without a plain message: {Last(text)}\n--- input:\n{Last(content)}");
                }

                return;
            }

            if (code is not (ExitCodes.Success or ExitCodes.Infeasible))
            {
                _failures.Add($"check ended with exit {code}: {Last(text)}\n--- input:\n{Last(content)}");
                return;
            }

            Count("valid");
            if (_solved.Count >= _solves || !_solved.Add(content))
            {
                return;
            }

            var clock = Stopwatch.StartNew();
            var (verdict, detail) = test.Solve(path);
            _solveSeconds += clock.Elapsed.TotalSeconds;
            Count("solve " + verdict);
            if (verdict is "crash" or "hang")
            {
                _failures.Add($"check said valid, then solve gave a {verdict}: {detail}\n--- input:\n{Last(content)}");
            }
        }

        public void Finish(ITestOutputHelper output)
        {
            var parts = new List<string>();
            foreach (var name in new[] { "checked", "refused by check", "valid", "solve solved", "solve refused", "solve crash", "solve hang" })
            {
                parts.Add($"{name} {_counts.GetValueOrDefault(name)}");
            }

            int solves = _counts.GetValueOrDefault("solve solved") + _counts.GetValueOrDefault("solve refused") + _counts.GetValueOrDefault("solve crash") + _counts.GetValueOrDefault("solve hang");
            string line = $"fuzz {reader}: {string.Join(", ", parts)}; {_clock.Elapsed.TotalSeconds:0} s in all, {(solves == 0 ? 0 : _solveSeconds / solves):0.0} s per solve";
            output.WriteLine(line);
            if (Environment.GetEnvironmentVariable("ANNEAL_FUZZ_REPORT") is { Length: > 0 } report)
            {
                File.AppendAllText(report, line + Environment.NewLine);
            }

            Assert.True(_failures.Count == 0, $"{line}\n{_failures.Count} failures; the first:\n{(_failures.Count == 0 ? string.Empty : _failures[0])}");

            // The harness must have reached a solve at all, or it tests check alone.
            Assert.True(_solves == 0 || solves > 0, line);
        }

        private void Count(string name) => _counts[name] = _counts.GetValueOrDefault(name) + 1;
    }
}
