using System.Runtime.InteropServices;

namespace Anneal.Cli.Reporting;

/// <summary>
/// Turns the first Ctrl+C (SIGINT) or SIGTERM into a cancellation, so solvers stop and the best plan so far is
/// written (exit 130); a second signal of either kind ends the process at once, whatever it is doing.
/// </summary>
public sealed class ShutdownSignals : IDisposable
{
    /// <summary>Exit code of a process ended by the second signal (as for an interrupted run).</summary>
    public const int ExitCode = 130;

    private readonly Action _stop;
    private readonly Action _exitNow;
    private readonly List<PosixSignalRegistration> _registrations = [];
    private int _signals;

    /// <param name="stop">What the first signal does (cancel the run, stop the host).</param>
    /// <param name="exitNow">What the second does; by default the process exits at once with <see cref="ExitCode"/>.</param>
    public ShutdownSignals(Action stop, Action? exitNow = null)
    {
        _stop = stop;
        _exitNow = exitNow ?? ExitNow;
        foreach (var signal in new[] { PosixSignal.SIGINT, PosixSignal.SIGTERM })
        {
            try
            {
                _registrations.Add(PosixSignalRegistration.Create(signal, OnSignal));
            }
            catch (PlatformNotSupportedException)
            {
                // A platform without this signal still has the others.
            }
        }
    }

    public ShutdownSignals(CancellationTokenSource source, Action? exitNow = null)
        : this(() => Cancel(source), exitNow)
    {
    }

    /// <summary>How many signals arrived so far.</summary>
    public int Received => Volatile.Read(ref _signals);

    /// <summary>Handles one signal as the operating system's would be; public so tests can drive it without one.</summary>
    public void Signal()
    {
        if (Interlocked.Increment(ref _signals) == 1)
        {
            _stop();
        }
        else
        {
            _exitNow();
        }
    }

    public void Dispose()
    {
        foreach (var registration in _registrations)
        {
            registration.Dispose();
        }
    }

    private void OnSignal(PosixSignalContext context)
    {
        context.Cancel = true;
        Signal();
    }

    /// <summary>
    /// Ends the process now: no waiting for solver threads or native searches, nor for hosted services. Files are
    /// written through a temporary name and a rename, so none is left half-written.
    /// </summary>
    private static void ExitNow()
    {
        Console.Error.WriteLine("anneal: second signal: stopping at once.");
        Environment.Exit(ExitCode);
    }

    private static void Cancel(CancellationTokenSource source)
    {
        try
        {
            source.Cancel();
        }
        catch (ObjectDisposedException)
        {
            // The run already finished.
        }
    }
}
