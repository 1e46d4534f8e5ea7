using Google.OrTools.Sat;

namespace Anneal.OrTools;

/// <summary>
/// A CP-SAT solve that a cancellation stops at any moment, and that leaves the process's signals to the host.
/// <para>
/// CP-SAT catches SIGINT itself unless told not to (`catch_sigint_signal`, default true): for the length of a solve
/// it replaces the process's handler with one that calls a thread-local function, empty on every thread but the
/// solving one, so a Ctrl+C delivered to any other thread aborted the process (std::bad_function_call), and at the
/// solve's end it resets SIGINT to the default action, which would kill the process on a later Ctrl+C without its
/// plan. Every solve here turns that off; the host's own handler turns a signal into the cancellation below.
/// </para>
/// <para>
/// CP-SAT's StopSearch only acts while the native search runs: called before it starts it is lost (the search then
/// ran its whole time limit after a SIGTERM). So a stop is passed on only once CP-SAT has written its first log
/// line, from inside the solve; a stop that comes earlier is passed on by the log callback itself, and one that
/// comes before the solve skips it.
/// </para>
/// </summary>
internal static class StoppableCpSat
{
    /// <summary>What every CP-SAT solve of Anneal's is given besides its own parameters.</summary>
    public const string HostParameters = "catch_sigint_signal:false log_search_progress:true log_to_stdout:false";

    /// <returns>CP-SAT's status; <see cref="CpSolverStatus.Unknown"/> when the stop came before the solve.</returns>
    public static CpSolverStatus Solve(CpSolver solver, CpModel model, CpSolverSolutionCallback? callback, CancellationToken cancel)
    {
        if (cancel.IsCancellationRequested)
        {
            return CpSolverStatus.Unknown;
        }

        int running = 0;
        solver.StringParameters += " " + HostParameters;
        solver.SetLogCallback(_ =>
        {
            // The first line comes from inside the native solve, so a stop is safe from here on.
            if (Interlocked.Exchange(ref running, 1) == 0 && cancel.IsCancellationRequested)
            {
                solver.StopSearch();
            }
        });
        using (cancel.Register(() =>
        {
            if (Volatile.Read(ref running) == 1)
            {
                solver.StopSearch();
            }
        }))
        {
            return solver.Solve(model, callback);
        }
    }
}
