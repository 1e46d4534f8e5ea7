
namespace Anneal.Core.Solving;

/// <summary>
/// Records a run's convergence: every improvement of the best, plus samples at a bounded rate, so a long run's
/// trace stays small. Forwards points to the live progress sink at most every 0.2 s.
/// </summary>
public sealed class TraceRecorder
{
    private const int MaxPoints = 5000;
    private readonly List<TracePoint> _points = [];
    private readonly IProgress<TracePoint>? _progress;
    private readonly double _sampleEvery;
    private double _lastSample = double.NegativeInfinity;
    private double _lastReport = double.NegativeInfinity;

    public TraceRecorder(IProgress<TracePoint>? progress, double budgetSeconds)
    {
        _progress = progress;
        _sampleEvery = Math.Max(0.05, budgetSeconds / 500);
    }

    public IReadOnlyList<TracePoint> Points => _points;

    public double SecondsToBest { get; private set; }

    public void Improved(TracePoint point)
    {
        SecondsToBest = point.Seconds;
        Add(point);
    }

    /// <summary>True when enough time passed since the last point for a sample; cheap to call often.</summary>
    public bool SampleDue(double seconds) => seconds - _lastSample >= _sampleEvery;

    /// <summary>Records a sample (call when <see cref="SampleDue"/> says so).</summary>
    public void Sample(TracePoint point) => Add(point);

    private void Add(TracePoint point)
    {
        _lastSample = point.Seconds;
        if (_points.Count < MaxPoints || point.BestObjective < _points[^1].BestObjective)
        {
            _points.Add(point);
        }

        if (_progress is not null && point.Seconds - _lastReport >= 0.2)
        {
            _lastReport = point.Seconds;
            _progress.Report(point);
        }
    }

    /// <summary>The final point, always recorded and reported.</summary>
    public void Finish(TracePoint point)
    {
        _points.Add(point);
        _progress?.Report(point);
    }
}
