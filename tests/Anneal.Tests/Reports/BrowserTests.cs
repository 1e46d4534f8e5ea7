using System.Text.RegularExpressions;
using Anneal.Formats.Output.Runs;

namespace Anneal.Tests.Reports;

/// <summary>Opens report.html in a real headless browser (Debian's chromium, installed by .ci/run); skips only when none exists.</summary>
public sealed class BrowserTests : TempFolderTest
{
    [SkippableFact]
    public void The_report_renders_in_chromium_with_the_solver_table_and_the_route_sheets()
    {
        string? browser = Chromium.Find();
        Skip.If(browser is null, Chromium.Missing);
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

    private string Run(string browser, string arguments) => Chromium.Run(browser, arguments, Dir);
}
