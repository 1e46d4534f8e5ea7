using System.Diagnostics;
using System.Text;

namespace Anneal.Tests.Fixtures;

/// <summary>
/// The real `anneal` as a separate process: anneal.dll from the test's output folder (the test project references
/// Anneal.Cli), run by the same dotnet host that runs the tests.
/// </summary>
internal sealed class AnnealProcess : IDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _log = new();

    private AnnealProcess(Process process)
    {
        _process = process;
    }

    public int Id => _process.Id;

    public int ExitCode => _process.ExitCode;

    /// <summary>Everything the worker printed, for failure messages.</summary>
    public string Log
    {
        get
        {
            lock (_log)
            {
                return _log.ToString();
            }
        }
    }

    /// <param name="directory">The current folder of the process.</param>
    /// <param name="environment">Variables set for the process, beside the tests' own.</param>
    public static AnnealProcess Start(string directory, IEnumerable<string> args, IReadOnlyDictionary<string, string>? environment = null)
    {
        var info = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            WorkingDirectory = directory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "anneal.dll"));
        foreach (var arg in args)
        {
            info.ArgumentList.Add(arg);
        }

        foreach (var (name, value) in environment ?? new Dictionary<string, string>())
        {
            info.Environment[name] = value;
        }

        var process = new Process { StartInfo = info };
        var started = new AnnealProcess(process);
        process.OutputDataReceived += (_, e) => started.Append(e.Data);
        process.ErrorDataReceived += (_, e) => started.Append(e.Data);
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return started;
    }

    /// <summary>Waits until a line of its output matches; false after <paramref name="seconds"/> (a generous deadline only).</summary>
    public bool WaitForLine(Func<string, bool> matches, double seconds = 60)
    {
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed.TotalSeconds < seconds && !_process.HasExited)
        {
            lock (_log)
            {
                if (_log.ToString().Split('\n').Any(matches))
                {
                    return true;
                }
            }

            Thread.Sleep(50);
        }

        return false;
    }

    /// <summary>Waits for the exit; a generous deadline only, so a hung process fails the test instead of hanging it.</summary>
    public int WaitForExit(double seconds = 30)
    {
        if (!_process.WaitForExit(TimeSpan.FromSeconds(seconds)))
        {
            _process.Kill(entireProcessTree: true);
            Assert.Fail($"anneal did not exit within {seconds} s; its log:\n{Log}");
        }

        _process.WaitForExit();
        return _process.ExitCode;
    }

    /// <summary>SIGKILL: no handler runs, exactly like a crash or the OOM killer.</summary>
    public void Kill()
    {
        _process.Kill(entireProcessTree: true);
        _process.WaitForExit();
    }

    /// <summary>SIGKILL of this process alone, leaving its children to notice by themselves.</summary>
    public void KillAlone()
    {
        _process.Kill(entireProcessTree: false);
        _process.WaitForExit();
    }

    /// <summary>SIGTERM, as systemd sends on stop.</summary>
    public void Terminate() => Send("TERM");

    /// <summary>SIGSTOP: the process freezes until <see cref="Continue"/>.</summary>
    public void Freeze() => Send("STOP");

    /// <summary>SIGCONT: a frozen process runs again.</summary>
    public void Continue() => Send("CONT");

    public bool HasExited => _process.HasExited;

    /// <summary>SIGINT, as Ctrl+C in a terminal.</summary>
    public void Interrupt() => Send("INT");

    /// <summary>
    /// Delivers the signals together: the process is paused (SIGSTOP), the signals are queued, and it resumes
    /// (SIGCONT) with all of them pending, so no work of its own can come between them however loaded the machine.
    /// </summary>
    public void SendTogether(params string[] signals)
    {
        Send("STOP");
        foreach (var signal in signals)
        {
            Send(signal);
        }

        Send("CONT");
    }

    private void Send(string signal)
    {
        using var kill = Process.Start("kill", ["-" + signal, _process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]);
        kill.WaitForExit();
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            _process.WaitForExit();
        }

        _process.Dispose();
    }

    private void Append(string? line)
    {
        if (line is not null)
        {
            lock (_log)
            {
                _log.AppendLine(line);
            }
        }
    }
}
