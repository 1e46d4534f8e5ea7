using Anneal.Bounds.Safety;
using Anneal.Core.Model;

namespace Anneal.Bounds.Relaxation;

/// <summary>
/// When service can start at a stop, as the evaluator decides it (the first window still open on arrival, waiting
/// for its opening), in flat arrays for the pricing loops. With hard windows an arrival after the last close
/// (widened by the tolerance) is impossible; with soft windows service starts on arrival.
/// </summary>
public sealed class ServiceStart
{
    private readonly int[] _offset;
    private readonly double[] _open;
    private readonly double[] _close;
    private readonly bool _hard;

    public ServiceStart(Instance instance)
    {
        int n = instance.StopCount;
        _hard = instance.Rules.TimeWindows.Hard;
        _offset = new int[n + 1];
        var open = new List<double>();
        var close = new List<double>();
        for (int i = 0; i < n; i++)
        {
            _offset[i] = open.Count;
            foreach (var w in instance.Stops[i].Windows)
            {
                open.Add(w.Open);
                close.Add(_hard ? Tolerance.Widen(w.Close) : w.Close);
            }
        }

        _offset[n] = open.Count;
        _open = open.ToArray();
        _close = close.ToArray();
    }

    /// <summary>Earliest service start for an arrival at <paramref name="arrival"/>; NaN when a hard window forbids it.</summary>
    public double At(int stop, double arrival)
    {
        int end = _offset[stop + 1];
        for (int w = _offset[stop]; w < end; w++)
        {
            if (_close[w] >= arrival)
            {
                double open = _open[w];
                return open > arrival ? open : arrival;
            }
        }

        return _hard ? double.NaN : arrival;
    }

    /// <summary>Latest arrival a hard window allows (widened); infinity with soft windows.</summary>
    public double LatestArrival(int stop) => _hard ? _close[_offset[stop + 1] - 1] : double.PositiveInfinity;
}
