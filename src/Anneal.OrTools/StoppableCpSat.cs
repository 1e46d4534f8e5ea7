using Google.OrTools.Sat;

namespace Anneal.OrTools;

/// <summary>
/// A CP-SAT solve that a cancellation stops at any moment. CP-SAT's StopSearch only acts while the native search
/// runs: called before it starts it is lost (the search then ran its whole time limit after a SIGTERM), and called
/// while the solve is still being set up it aborted the process (std::bad_function_call). So a stop is passed on
/// only once CP-SAT has written its first log line, from inside the solve; a stop that comes earlier is passed on
/// by the log callback itself, and one that comes before the solve skips it.
/// </summary>
internal static class StoppableCpSat
{
    /// <returns>CP-SAT's status; <see cref="CpSolverStatus.Unknown"/> when the stop came before the solve.</returns>
    public static CpSolverStatus Solve(CpSolver solver, CpModel model, CpSolverSolutionCallback? callback, CancellationToken cancel)
    {
        if (cancel.IsCancellationRequested)
        {
            return CpSolverStatus.Unknown;
        }

        int running = 0;
        solver.StringParameters += " log_search_progress:true log_to_stdout:false";
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
