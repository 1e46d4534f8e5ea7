namespace Anneal.Cli;

/// <summary>Where a command writes and what it may assume about its surroundings; tests pass string writers.</summary>
public sealed record CliContext(TextWriter Out, TextWriter Err)
{
    /// <summary>Progress may redraw one status line with carriage returns (stderr is a terminal).</summary>
    public bool ProgressIsTerminal { get; init; }

    /// <summary>Listen for Ctrl+C and SIGTERM while solving (the real process does; tests do not).</summary>
    public bool HandleSignals { get; init; }

    /// <summary>An outside stop request, as if the user had pressed Ctrl+C.</summary>
    public CancellationToken Cancel { get; init; }

    /// <summary>Base of the default output folder runs/&lt;instance&gt;-&lt;time&gt;.</summary>
    public string WorkingDirectory { get; init; } = Environment.CurrentDirectory;

    public Func<DateTime> Now { get; init; } = () => DateTime.Now;

    /// <summary>With --json: where the command writes its one JSON document (stdout; its text then goes to stderr).</summary>
    public TextWriter? Json { get; init; }

    /// <summary>Time since the process started, which `solve` counts against its budget; zero in tests (they share one process).</summary>
    public Func<TimeSpan> SinceStart { get; init; } = () => TimeSpan.Zero;

    /// <summary>The solver catalogue, job runner and run writers (<see cref="CliServices"/>); built once, read-only.</summary>
    public IServiceProvider Services { get; init; } = CliServices.Shared;
}
