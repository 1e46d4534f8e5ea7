using System.Diagnostics;

namespace Anneal.Tests.Fixtures;

/// <summary>A real headless browser for page tests: Debian's chromium (installed by .ci/run); tests skip only when none exists.</summary>
internal static class Chromium
{
    public const string Missing = "no chromium binary on this machine (.ci/run installs it with apt-get); browser test skipped";

    /// <summary>The browser's path on PATH; null when there is none.</summary>
    public static string? Find()
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

    /// <summary>Runs the browser headless with a throw-away profile; returns what it printed (the DOM for --dump-dom).</summary>
    public static string Run(string browser, string arguments, string workingDirectory)
    {
        string profile = Directory.CreateTempSubdirectory("anneal-chromium-").FullName;
        try
        {
            var info = new ProcessStartInfo(browser,
                $"--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking --disable-component-update --disable-sync --user-data-dir={profile} {arguments}")
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                WorkingDirectory = workingDirectory,
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
