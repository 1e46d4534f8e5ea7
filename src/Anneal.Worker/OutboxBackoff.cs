namespace Anneal.Worker;

/// <summary>
/// After the outbox ran out of space, the worker claims nothing for a while (5 s, then twice as long each time up to
/// 5 minutes), since every job solved meanwhile would fail to publish too; a job published resets the wait.
/// Shared by the job threads that report and the loop that claims.
/// </summary>
public sealed class OutboxBackoff
{
    private static readonly TimeSpan First = TimeSpan.FromSeconds(5);
    private static readonly TimeSpan Longest = TimeSpan.FromMinutes(5);
    private readonly Lock _lock = new();
    private TimeSpan _wait = TimeSpan.Zero;
    private DateTimeOffset _until = DateTimeOffset.MinValue;

    /// <summary>Jobs that could not be published because the disk was full, since the worker started.</summary>
    public int Unpublished { get; private set; }

    /// <returns>How long the worker now waits before it claims again.</returns>
    public TimeSpan Full(DateTimeOffset now)
    {
        lock (_lock)
        {
            Unpublished++;
            _wait = _wait == TimeSpan.Zero ? First : TimeSpan.FromTicks(Math.Min(_wait.Ticks * 2, Longest.Ticks));
            _until = now + _wait;
            return _wait;
        }
    }

    public void Published()
    {
        lock (_lock)
        {
            _wait = TimeSpan.Zero;
            _until = DateTimeOffset.MinValue;
        }
    }

    public bool Paused(DateTimeOffset now)
    {
        lock (_lock)
        {
            return now < _until;
        }
    }
}
