using System.Diagnostics;
using System.Text;

namespace Anneal.Tests.Worker;

/// <summary>
/// The real `anneal worker` as a separate process: anneal.dll from the test's output folder (the test project
/// references Anneal.Cli), run by the same dotnet host that runs the tests.
/// </summary>
public sealed class WorkerProcess : IDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _log = new();

    private WorkerProcess(Process process)
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

    /// <param name="root">Holds inbox/ and outbox/ (working/ and failed/ default to beside the inbox); also the current folder.</param>
    public static WorkerProcess Start(string root, params string[] args) => Start(root, new Dictionary<string, string>(), args);

    /// <param name="settings">Worker settings that replace the test defaults, e.g. { "SettleSeconds", "1" }.</param>
    public static WorkerProcess Start(string root, IReadOnlyDictionary<string, string> settings, params string[] args)
    {
        var info = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            WorkingDirectory = root,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "anneal.dll"));
        foreach (var arg in new[] { "worker", "--inbox", "inbox", "--outbox", "outbox" }.Concat(args))
        {
            info.ArgumentList.Add(arg);
        }

        // Tests drop jobs by rename, so they need no settling time; short polls keep the tests quick.
        info.Environment["ANNEAL_Worker__SettleSeconds"] = "0";
        info.Environment["ANNEAL_Worker__PollSeconds"] = "0.2";
        info.Environment["ANNEAL_Worker__StatusSeconds"] = "0.2";
        info.Environment["ANNEAL_Worker__ShutdownTimeoutSeconds"] = "10";
        foreach (var (key, value) in settings)
        {
            info.Environment["ANNEAL_Worker__" + key] = value;
        }

        var process = new Process { StartInfo = info };
        var worker = new WorkerProcess(process);
        process.OutputDataReceived += (_, e) => worker.Append(e.Data);
        process.ErrorDataReceived += (_, e) => worker.Append(e.Data);
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return worker;
    }

    /// <summary>Waits for the exit; a generous deadline only, so a hung worker fails the test instead of hanging it.</summary>
    public int WaitForExit(double seconds = 30)
    {
        if (!_process.WaitForExit(TimeSpan.FromSeconds(seconds)))
        {
            _process.Kill(entireProcessTree: true);
            Assert.Fail($"the worker did not exit within {seconds} s; its log:\n{Log}");
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

    /// <summary>SIGTERM, as systemd sends on stop.</summary>
    public void Terminate()
    {
        using var kill = Process.Start("kill", ["-TERM", _process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]);
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
