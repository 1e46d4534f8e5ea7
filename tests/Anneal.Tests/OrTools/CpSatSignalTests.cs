using System.Runtime.InteropServices;
using Anneal.Core.Solving;
using Anneal.OrTools;

namespace Anneal.Tests.OrTools;

/// <summary>
/// CP-SAT leaves the process's SIGINT handler alone. By default it installs its own for the length of a solve (one
/// that aborts the process with std::bad_function_call when the signal reaches any thread but the solving one) and
/// resets SIGINT to the default action afterwards (sat_parameters.proto, catch_sigint_signal; seen in
/// SigintHandler::Register and ~SigintHandler of the OR-Tools 9.15 library). The handler is read before and after
/// an exact solve with sigaction(2), which changes nothing when given no new action.
/// </summary>
public sealed partial class CpSatSignalTests
{
    private const int SigInt = 2;

    [SkippableFact]
    public void An_exact_solve_leaves_the_SIGINT_handler_as_it_found_it()
    {
        Skip.IfNot(OperatingSystem.IsLinux(), "reads the handler with Linux's sigaction layout");
        long before = SigIntHandler();
        var instance = TinyInstances.Random(1, 7, 2);
        var result = new ExactSolver(new ExactSettings { Workers = 2 }).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(30) }, null, default);

        Assert.Equal(SolverStatus.Optimal, result.Status); // CP-SAT ran (a proof takes under 2 s), so its handler would have been installed
        Assert.Equal(before, SigIntHandler());
    }

    /// <summary>The handler's address (sa_handler, the first field of glibc's struct sigaction on Linux).</summary>
    private static long SigIntHandler()
    {
        nint old = Marshal.AllocHGlobal(256); // struct sigaction is 152 bytes on x86-64 and arm64 glibc
        try
        {
            Assert.Equal(0, SigAction(SigInt, 0, old));
            return Marshal.ReadInt64(old);
        }
        finally
        {
            Marshal.FreeHGlobal(old);
        }
    }

    [LibraryImport("libc", EntryPoint = "sigaction")]
    private static partial int SigAction(int signal, nint action, nint old);
}
