using System.Diagnostics;
using System.Text.RegularExpressions;
using Anneal.Formats.Output.Runs;

namespace Anneal.Tests.Reports;

/// <summary>Opens report.html in a real headless browser (Debian's chromium, installed by .ci/run); skips only when none exists.</summary>
public sealed class BrowserTests : TempFolderTest
{
    [SkippableFact]
    public void The_report_renders_in_chromium_with_the_solver_table_and_the_route_sheets()
    {
        string? browser = Find();
        Skip.If(browser is null, "no chromium binary on this machine (.ci/run installs it with apt-get); browser test skipped");
        string folder = SavedRun.Solve(Dir);
        string url = new Uri(Path.Combine(folder, "report.html")).AbsoluteUri;
        string shot = Path.Combine(Dir, "shot.png");

        Run(browser!, $"--screenshot={shot} --window-size=1280,1600 {url}");
        string dom = Run(browser!, $"--dump-dom {url}");

        PngCheck.Valid(File.ReadAllBytes(shot), 1280, 1600);
        int used = RunRecordFile.Read(Path.Combine(folder, RunRecordFile.FileName)).Routes.Count(r => r.Stops.Count > 0);
        Assert.Contains("id=\"solver-table\"", dom, StringComparison.Ordinal);
        Assert.Equal(used, Regex.Count(dom, "<section class=\"sheet\""));
    }

    private static string? Find()
    {
        foreach (var name in new[] { "chromium", "chromium-browser" })
        {
            foreach (var dir in (Environment.GetEnvironmentVariable("PATH") ?? string.Empty).Split(Path.PathSeparator))
            {
                string path = Path.Combine(dir, name);
                if (File.Exists(path))
                {
                    return path;
                }
            }
        }

        return null;
    }

    private string Run(string browser, string arguments)
    {
        string profile = Directory.CreateTempSubdirectory("anneal-chromium-").FullName;
        try
        {
            var info = new ProcessStartInfo(browser,
                $"--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking --disable-component-update --disable-sync --user-data-dir={profile} {arguments}")
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                WorkingDirectory = Dir,
            };
            using var process = Process.Start(info)!;
            var stderr = process.StandardError.ReadToEndAsync();
            string stdout = process.StandardOutput.ReadToEnd();
            Assert.True(process.WaitForExit(90_000), "chromium did not finish in 90 s");
            _ = stderr.Result;
            return stdout;
        }
        finally
        {
            Directory.Delete(profile, recursive: true);
        }
    }
}
