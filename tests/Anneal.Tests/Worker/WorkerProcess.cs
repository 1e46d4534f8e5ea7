namespace Anneal.Tests.Worker;

/// <summary>
/// The real `anneal worker` as a separate process (an <see cref="AnnealProcess"/> with the worker's command line and
/// short polls for tests).
/// </summary>
public sealed class WorkerProcess : IDisposable
{
    private readonly AnnealProcess _process;

    private WorkerProcess(AnnealProcess process)
    {
        _process = process;
    }

    public int Id => _process.Id;

    public int ExitCode => _process.ExitCode;

    /// <summary>Everything the worker printed, for failure messages.</summary>
    public string Log => _process.Log;

    /// <param name="root">Holds inbox/ and outbox/ (working/ and failed/ default to beside the inbox); also the current folder.</param>
    public static WorkerProcess Start(string root, params string[] args) => Start(root, new Dictionary<string, string>(), args);

    /// <param name="settings">Worker settings that replace the test defaults, e.g. { "SettleSeconds", "1" }.</param>
    public static WorkerProcess Start(string root, IReadOnlyDictionary<string, string> settings, params string[] args) =>
        Start(root, settings, new Dictionary<string, string>(), args);

    /// <param name="extra">Further environment variables, as they are (the solver processes inherit them).</param>
    public static WorkerProcess Start(string root, IReadOnlyDictionary<string, string> settings, IReadOnlyDictionary<string, string> extra, params string[] args)
    {
        // Tests drop jobs by rename, so they need no settling time; short polls keep the tests quick.
        var environment = new Dictionary<string, string>
        {
            ["ANNEAL_Worker__SettleSeconds"] = "0",
            ["ANNEAL_Worker__PollSeconds"] = "0.2",
            ["ANNEAL_Worker__StatusSeconds"] = "0.2",
            ["ANNEAL_Worker__ShutdownTimeoutSeconds"] = "10",
        };
        foreach (var (key, value) in settings)
        {
            environment["ANNEAL_Worker__" + key] = value;
        }

        foreach (var (key, value) in extra)
        {
            environment[key] = value;
        }

        return Launch(root, ["worker", "--inbox", "inbox", "--outbox", "outbox", .. args], environment);
    }

    /// <summary>`anneal` with these arguments and extra environment variables, in <paramref name="root"/>.</summary>
    public static WorkerProcess Launch(string root, IEnumerable<string> args, IReadOnlyDictionary<string, string> environment) =>
        new(AnnealProcess.Start(root, args, environment));

    /// <summary>
    /// Waits for the exit; a generous deadline only, so a hung worker fails the test instead of hanging it (each job's
    /// solver process starts the runtime afresh, seconds on a loaded machine).
    /// </summary>
    public int WaitForExit(double seconds = 120) => _process.WaitForExit(seconds);

    /// <summary>SIGKILL: no handler runs, exactly like a crash or the OOM killer.</summary>
    public void Kill() => _process.Kill();

    /// <summary>SIGKILL of the worker alone: its solver process is left to notice by itself.</summary>
    public void KillAlone() => _process.KillAlone();

    /// <summary>The pids of this worker's solver processes (`anneal run-job`), read from /proc.</summary>
    public IReadOnlyList<int> SolverProcesses() => ChildProcesses.Of(_process.Id, "run-job");

    /// <summary>SIGTERM, as systemd sends on stop.</summary>
    public void Terminate() => _process.Terminate();

    /// <summary>SIGSTOP: the process freezes (a machine that hangs, a long pause) until <see cref="Continue"/>.</summary>
    public void Freeze() => _process.Freeze();

    public void Continue() => _process.Continue();

    public bool HasExited => _process.HasExited;

    public void Dispose() => _process.Dispose();
}
