using Anneal.Core.Solving;

namespace Anneal.Worker;

/// <summary>
/// The latest trace point of each solver on one running job, and whether a log line about it is due (at most one per
/// solver every 10 s keeps an overnight log readable). Solvers report from their own threads, hence the lock.
/// </summary>
public sealed class SolverPoints(TimeProvider clock)
{
    private static readonly TimeSpan LogEvery = TimeSpan.FromSeconds(10);

    private readonly Lock _lock = new();
    private readonly Dictionary<string, TracePoint> _latest = new(StringComparer.Ordinal);
    private readonly Dictionary<string, DateTimeOffset> _logged = new(StringComparer.Ordinal);

    /// <returns>True when this point should be logged.</returns>
    public bool Record(string solver, TracePoint point)
    {
        lock (_lock)
        {
            _latest[solver] = point;
            var now = clock.GetUtcNow();
            bool due = !_logged.TryGetValue(solver, out var last) || now - last >= LogEvery;
            if (due)
            {
                _logged[solver] = now;
            }

            return due;
        }
    }

    /// <summary>Each solver's latest point, by solver name.</summary>
    public List<(string Solver, TracePoint Point)> Latest()
    {
        var list = new List<(string, TracePoint)>();
        lock (_lock)
        {
            foreach (var (name, p) in _latest)
            {
                list.Add((name, p));
            }
        }

        list.Sort((a, b) => string.CompareOrdinal(a.Item1, b.Item1));
        return list;
    }
}
