using System.Globalization;

namespace Anneal.Tests.Worker;

/// <summary>Finds a process's children in /proc (Linux) and sends them signals with the system's `kill`.</summary>
internal static class ChildProcesses
{
    /// <summary>Children of <paramref name="parent"/> whose command line holds <paramref name="word"/>.</summary>
    public static IReadOnlyList<int> Of(int parent, string word)
    {
        var found = new List<int>();
        foreach (var dir in Directory.GetDirectories("/proc"))
        {
            if (!int.TryParse(Path.GetFileName(dir), NumberStyles.None, CultureInfo.InvariantCulture, out int pid))
            {
                continue;
            }

            try
            {
                // stat: "pid (name) state ppid ..."; the name may hold spaces, so read after its closing parenthesis.
                string stat = File.ReadAllText(Path.Combine(dir, "stat"));
                var fields = stat[(stat.LastIndexOf(')') + 2)..].Split(' ');
                if (int.Parse(fields[1], CultureInfo.InvariantCulture) != parent)
                {
                    continue;
                }

                var args = File.ReadAllText(Path.Combine(dir, "cmdline")).Split('\0');
                if (args.Contains(word))
                {
                    found.Add(pid);
                }
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // It ended while being read.
            }
        }

        return found;
    }

    public static bool Alive(int pid) => Directory.Exists($"/proc/{pid}") && !File.ReadAllText($"/proc/{pid}/stat").Contains(") Z ", StringComparison.Ordinal);

    public static void Signal(int pid, string signal)
    {
        using var kill = System.Diagnostics.Process.Start("kill", ["-" + signal, pid.ToString(CultureInfo.InvariantCulture)]);
        kill.WaitForExit();
        Assert.Equal(0, kill.ExitCode);
    }
}
