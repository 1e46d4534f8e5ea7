using System.Diagnostics;
using Anneal.Core.Solving;

namespace Anneal.Search.Strategy;

/// <summary>
/// When a run must stop, and how far through its budget it is. With an iteration limit, progress is counted in
/// iterations, so cooling and every other schedule depend only on the seed: the run is reproducible.
/// </summary>
public sealed class Budget
{
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly double _seconds;
    private readonly long _iterations;
    private readonly CancellationToken _cancel;
    private bool _timeUp;
    private long _nextCheck;
    private long _checkEvery = 1;
    private double _lastCheck;
    private bool _iterationsUp;
    private bool _targetReached;

    public Budget(SolveOptions options, CancellationToken cancel)
    {
        _seconds = Math.Max(0.001, options.TimeLimit.TotalSeconds);
        _iterations = options.IterationLimit ?? long.MaxValue;
        _cancel = cancel;
    }

    public double Elapsed => _clock.Elapsed.TotalSeconds;

    public bool IterationBound => _iterations != long.MaxValue;

    public bool Cancelled => _cancel.IsCancellationRequested;

    public bool TimeUp => _timeUp;

    /// <summary>
    /// True once any limit is reached. Reads the clock about once a millisecond whatever an iteration costs: every
    /// iteration of a tabu scan over 1,000 stops (which takes a second when 64 searches share two cores), every few
    /// hundred of an annealing step. Reading it every 64 iterations let tabu overrun a 5 s budget by seconds.
    /// </summary>
    public bool Exhausted(long iteration)
    {
        if (iteration >= _iterations)
        {
            _iterationsUp = true;
            return true;
        }

        if (iteration >= _nextCheck)
        {
            double now = _clock.Elapsed.TotalSeconds;
            _timeUp = _timeUp || now >= _seconds || _cancel.IsCancellationRequested;
            double gap = now - _lastCheck;
            _checkEvery = gap < 0.0005 ? Math.Min(_checkEvery * 2, 4096) : gap > 0.002 ? Math.Max(_checkEvery / 2, 1) : _checkEvery;
            _lastCheck = now;
            _nextCheck = iteration + _checkEvery;
        }

        return _timeUp;
    }

    /// <summary>Fraction of the budget used, 0 to 1: iterations when they bound the run, else wall-clock time.</summary>
    public double Progress(long iteration) =>
        IterationBound ? Math.Min(1.0, (double)iteration / _iterations) : Math.Min(1.0, Elapsed / _seconds);

    /// <summary>Call when the run stops because it holds a plan at or below the target.</summary>
    public void ReachTarget() => _targetReached = true;

    /// <summary>Why the run stopped: a stop request first, then the target, the iteration limit, the clock; else it ended by itself.</summary>
    public SolverStatus StopReason =>
        Cancelled ? SolverStatus.Interrupted
        : _targetReached ? SolverStatus.TargetReached
        : _iterationsUp ? SolverStatus.IterationLimit
        : _timeUp ? SolverStatus.TimeLimit
        : SolverStatus.Completed;
}
