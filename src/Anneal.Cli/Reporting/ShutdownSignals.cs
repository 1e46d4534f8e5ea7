using System.Runtime.InteropServices;

namespace Anneal.Cli.Reporting;

/// <summary>
/// Turns Ctrl+C and SIGTERM into a cancellation so solvers stop and the best plan so far is written.
/// A second Ctrl+C is left to the default handling and ends the process at once.
/// </summary>
public sealed class ShutdownSignals : IDisposable
{
    private readonly CancellationTokenSource _source;
    private readonly PosixSignalRegistration? _sigterm;

    public ShutdownSignals(CancellationTokenSource source)
    {
        _source = source;
        Console.CancelKeyPress += OnCancelKeyPress;
        try
        {
            _sigterm = PosixSignalRegistration.Create(PosixSignal.SIGTERM, context =>
            {
                context.Cancel = true;
                Stop();
            });
        }
        catch (PlatformNotSupportedException)
        {
            // Platforms without SIGTERM still have Ctrl+C.
            _sigterm = null;
        }
    }

    public void Dispose()
    {
        Console.CancelKeyPress -= OnCancelKeyPress;
        _sigterm?.Dispose();
    }

    private void OnCancelKeyPress(object? sender, ConsoleCancelEventArgs e)
    {
        if (_source.IsCancellationRequested)
        {
            return;
        }

        e.Cancel = true;
        Stop();
    }

    private void Stop()
    {
        try
        {
            _source.Cancel();
        }
        catch (ObjectDisposedException)
        {
            // The run already finished.
        }
    }
}
