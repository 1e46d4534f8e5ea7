using System.Diagnostics;
using System.Globalization;
using Anneal.Core.Solving;

namespace Anneal.OrTools.Bounds;

/// <summary>Keeps the strongest proven bound so far and traces each rise (see <see cref="BoundTrace"/>).</summary>
internal sealed class BoundKeeper(TraceRecorder trace, Stopwatch clock)
{
    private long _steps;

    public double? Best { get; private set; }

    public string? Source { get; private set; }

    /// <summary>Offers a bound; NaN or a weaker value is ignored.</summary>
    public void Offer(double bound, string source)
    {
        _steps++;
        if (double.IsNaN(bound) || (Best is { } b && bound <= b))
        {
            return;
        }

        Best = bound;
        Source = source;
        trace.Improved(Point(source));
    }

    public TracePoint Point(string source) => new(clock.Elapsed.TotalSeconds, _steps, Best ?? double.NaN, Best ?? double.NaN, false,
        string.Create(CultureInfo.InvariantCulture, $"{BoundTrace.Prefix} ({source})"));
}
