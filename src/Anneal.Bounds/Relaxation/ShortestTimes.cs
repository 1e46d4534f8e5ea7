using Anneal.Core.Model;
using Anneal.Core.Travel;

namespace Anneal.Bounds.Relaxation;

/// <summary>
/// A lower bound on the time from leaving one location to reaching another along any route, which the tests "this
/// stop cannot be reached in time" rely on. Going straight there is quickest only when travel times obey the
/// triangle inequality: true of plain Euclidean distances, not of rounded ones or of a given matrix. Those get the
/// shortest path through other stops (travel plus their service; Floyd–Warshall, common practice) when the instance
/// is small enough, and no bound at all (zero) otherwise, which only weakens the tests.
/// </summary>
public sealed class ShortestTimes
{
    /// <summary>Above this many locations the all-pairs shortest paths cost too much (cubic) and are skipped.</summary>
    public const int PathLimit = 450;

    private readonly TravelTable _travel;
    private readonly double[]? _paths;
    private readonly bool _none;
    private readonly int _count;

    public ShortestTimes(Instance instance)
    {
        _travel = instance.Travel;
        _count = _travel.Count;
        if (_travel.Rule == DistanceRule.Euclidean)
        {
            return;
        }

        if (_count > PathLimit)
        {
            _none = true;
            return;
        }

        int n = _count;
        var p = new double[n * n];
        for (int a = 0; a < n; a++)
        {
            for (int b = 0; b < n; b++)
            {
                p[(a * n) + b] = a == b ? 0 : _travel.Duration(a, b);
            }
        }

        // Passing through stop k costs its service too; depots are not passed through.
        for (int k = 0; k < instance.StopCount; k++)
        {
            double service = instance.ServiceTime(k);
            for (int a = 0; a < n; a++)
            {
                double ak = p[(a * n) + k] + service;
                for (int b = 0; b < n; b++)
                {
                    double via = ak + p[(k * n) + b];
                    if (via < p[(a * n) + b])
                    {
                        p[(a * n) + b] = via;
                    }
                }
            }
        }

        _paths = p;
    }

    /// <summary>At most the time any route needs from leaving <paramref name="from"/> to arriving at <paramref name="to"/>.</summary>
    public double Between(int from, int to) =>
        _none ? 0 : _paths is { } p ? p[(from * _count) + to] : _travel.Duration(from, to);
}
