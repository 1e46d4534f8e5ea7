using System.Diagnostics;

namespace Anneal.Core.Solving;

/// <summary>Waits for threads that should end by a deadline, but not for ever: a thread late beyond the slack is left.</summary>
public static class DeadlineJoin
{
    private static readonly TimeSpan Poll = TimeSpan.FromMilliseconds(50);

    /// <summary>
    /// Waits for every thread until <paramref name="budget"/> plus <paramref name="slack"/> on
    /// <paramref name="clock"/>, or until the slack past a stop request when that comes first.
    /// </summary>
    /// <returns>True when every thread ended; false when some were left running.</returns>
    public static bool Wait(IEnumerable<Thread> threads, TimeSpan budget, TimeSpan slack, Stopwatch clock, CancellationToken stop)
    {
        TimeSpan? stopAt = null;
        bool all = true;
        foreach (var thread in threads)
        {
            while (true)
            {
                stopAt ??= stop.IsCancellationRequested ? clock.Elapsed : null;
                var left = (stopAt is { } at && at < budget ? at : budget) + slack - clock.Elapsed;
                if (left <= TimeSpan.Zero)
                {
                    // Past the deadline: the threads still running are left, without waiting for each in turn.
                    all &= !thread.IsAlive;
                    break;
                }

                if (thread.Join(left < Poll ? left : Poll))
                {
                    break;
                }
            }
        }

        return all;
    }
}
