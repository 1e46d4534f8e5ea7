using System.Runtime.InteropServices;

namespace Anneal.Worker.Isolation;

/// <summary>Sends a POSIX signal to a process (.NET only kills outright), and names signals for messages.</summary>
internal static partial class Signals
{
    public const int Term = 15;
    public const int Kill = 9;

    /// <returns>False when the signal could not be sent (no such process, or not on a POSIX system).</returns>
    public static bool Send(int pid, int signal)
    {
        if (OperatingSystem.IsWindows())
        {
            return false;
        }

        try
        {
            return KillProcess(pid, signal) == 0;
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
    }

    /// <summary>"SIGABRT: aborted, e.g. a failed check in native code" and the like.</summary>
    public static string Describe(int signal) => signal switch
    {
        6 => "SIGABRT: aborted, e.g. a failed check in native code",
        9 => "SIGKILL: killed, e.g. by the out-of-memory killer",
        11 => "SIGSEGV: an invalid memory access",
        15 => "SIGTERM: asked to stop",
        4 => "SIGILL",
        7 => "SIGBUS",
        8 => "SIGFPE",
        _ => "signal " + signal,
    };

    [LibraryImport("libc", EntryPoint = "kill")]
    private static partial int KillProcess(int pid, int signal);
}
