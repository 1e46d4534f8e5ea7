using System.Diagnostics;
using Anneal.Core.Solving;

namespace Anneal.Worker.Isolation;

/// <summary>
/// Runs one job's search in its own process (the same `anneal` executable, command <c>run-job</c>), so that a native
/// failure (an abort in OR-Tools, a segmentation fault, the out-of-memory killer) or a hang ends that process only:
/// the worker and its other jobs go on, and the job fails with the true reason ("the solver process ended with signal
/// 6 (SIGABRT: ...) in the OR-Tools phase"). A stop request reaches the process as SIGTERM, so it still writes its best
/// plan; a process that does not end within the shutdown time, or runs past its budget and grace, is killed.
/// </summary>
public sealed class ChildRun(SolverProcess executable)
{
    private const int StderrKept = 5;

    /// <summary>A search that has not ended a generous while after its budget is taken to hang: the grace, or a quarter of the budget if longer.</summary>
    public static TimeSpan Deadline(double budgetSeconds, double graceSeconds) => TimeSpan.FromSeconds(budgetSeconds + Math.Max(graceSeconds, budgetSeconds / 4));

    /// <param name="arguments">The arguments after the executable (the command and its options).</param>
    /// <param name="deadline">Budget plus grace: past it the process counts as hung.</param>
    /// <param name="shutdown">How long a process asked to stop (SIGTERM) may take before it is killed.</param>
    /// <param name="progress">Receives the solvers' trace points as the process reports them.</param>
    public ChildOutcome Run(IReadOnlyList<string> arguments, TimeSpan deadline, TimeSpan shutdown, Action<string, TracePoint> progress, CancellationToken stop)
    {
        var info = new ProcessStartInfo(executable.FileName)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (var a in executable.Prefix.Concat(arguments))
        {
            info.ArgumentList.Add(a);
        }

        var events = new Events(progress);
        using var process = new Process { StartInfo = info };
        process.OutputDataReceived += (_, e) =>
        {
            if (e.Data is not null)
            {
                ChildProtocol.Read(e.Data, events);
            }
        };
        process.ErrorDataReceived += (_, e) => events.Stderr(e.Data);
        var clock = Stopwatch.StartNew();
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();

        TimeSpan? stopAsked = null;
        bool hung = false;
        while (!process.WaitForExit(100))
        {
            if (stop.IsCancellationRequested && stopAsked is null)
            {
                stopAsked = clock.Elapsed;
                Signals.Send(process.Id, Signals.Term);
            }
            else if (!hung && stopAsked is null && clock.Elapsed > deadline)
            {
                hung = true;
                stopAsked = clock.Elapsed;
                Signals.Send(process.Id, Signals.Term);
            }

            if (stopAsked is { } asked && clock.Elapsed - asked > shutdown)
            {
                try
                {
                    process.Kill(entireProcessTree: true);
                }
                catch (InvalidOperationException)
                {
                    // it ended meanwhile
                }
            }
        }

        process.WaitForExit(); // the last output lines are read before this returns
        if (events.NoSpace is { } full)
        {
            return new ChildOutcome.NoSpace(full);
        }
        if (events.Result is { } result && !hung)
        {
            return new ChildOutcome.Completed(result);
        }

        if (hung)
        {
            return new ChildOutcome.Failed($"the solver process was still running {clock.Elapsed.TotalSeconds:0} s after it started, past its budget and grace of {deadline.TotalSeconds:0} s, and was stopped {events.Phase()}");
        }

        if (stop.IsCancellationRequested)
        {
            return new ChildOutcome.Stopped();
        }

        int code = process.ExitCode;

        // .NET reports a process ended by a signal as 128 + the signal; the solver process itself exits with 0-4 or 130.
        return code > 128 && code != 130
            ? new ChildOutcome.Failed($"the solver process ended with signal {code - 128} ({Signals.Describe(code - 128)}) {events.Phase()}")
            : new ChildOutcome.Failed($"the solver process exited with code {code} without writing a plan {events.Phase()}{events.LastError()}");
    }

    /// <summary>What the process said so far; written from the output threads, read after the exit.</summary>
    private sealed class Events(Action<string, TracePoint> progress) : IChildEvents
    {
        private readonly Lock _lock = new();
        private readonly List<string> _running = [];
        private readonly Queue<string> _stderr = new();
        private bool _anyBegan;

        public ChildResult? Result { get; private set; }

        public string? NoSpace { get; private set; }

        public void OutOfSpace(string reason)
        {
            lock (_lock)
            {
                NoSpace = reason;
            }
        }

        public void Began(string solver)
        {
            lock (_lock)
            {
                _anyBegan = true;
                _running.Add(solver);
            }
        }

        public void Ended(string solver)
        {
            lock (_lock)
            {
                _running.Remove(solver);
            }
        }

        public void Improved(string solver, TracePoint point) => progress(solver, point);

        public void Finished(ChildResult result)
        {
            lock (_lock)
            {
                Result = result;
            }
        }

        public void Stderr(string? line)
        {
            if (string.IsNullOrWhiteSpace(line))
            {
                return;
            }

            lock (_lock)
            {
                _stderr.Enqueue(Formats.Input.Quote.Cap(line.Trim(), 200));
                if (_stderr.Count > StderrKept)
                {
                    _stderr.Dequeue();
                }
            }
        }

        /// <summary>"in the OR-Tools phase", "while reading the job", "while writing the results".</summary>
        public string Phase()
        {
            lock (_lock)
            {
                if (!_anyBegan)
                {
                    return "while reading the job";
                }

                if (_running.Count == 0)
                {
                    return "while writing the results";
                }

                var names = _running.Select(Named).ToList();
                return $"in the {string.Join(" and ", names)} phase";
            }
        }

        public string LastError()
        {
            lock (_lock)
            {
                return _stderr.Count == 0 ? string.Empty : ": " + string.Join(" | ", _stderr);
            }
        }

        private static string Named(string solver) => solver switch
        {
            "ortools" => "OR-Tools",
            "exact" => "CP-SAT (exact)",
            "bound" => "bound (GLOP)",
            _ => solver,
        };
    }
}
