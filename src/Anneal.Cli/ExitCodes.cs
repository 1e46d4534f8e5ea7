namespace Anneal.Cli;

/// <summary>The exit codes every command shares (see the README's table).</summary>
public static class ExitCodes
{
    public const int Success = 0;
    public const int InternalError = 1;
    public const int InvalidInput = 2;
    public const int Infeasible = 3;
    public const int OutputFailed = 4;

    /// <summary>The queue's database cannot be reached, holds no queue, or is at another schema version.</summary>
    public const int QueueUnavailable = 5;

    /// <summary>128 + SIGINT, the shell convention for a run stopped by Ctrl+C.</summary>
    public const int Interrupted = 130;
}
