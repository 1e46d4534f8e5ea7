namespace Anneal.Core.Travel;

/// <summary>
/// Distance and duration between location indices (stops first, then depots). Small instances keep dense
/// matrices; large planar ones compute arcs on the fly so 10,000 stops fit in little memory.
/// Sealed and branch-on-field rather than virtual so the move-evaluation loop stays cheap.
/// </summary>
public sealed class TravelTable
{
    /// <summary>
    /// Above this many locations planar distances are computed on the fly: a square root costs less than the cache
    /// miss of a matrix that no longer fits in cache (measured with `anneal bench` on 1,000 stops).
    /// </summary>
    public const int DenseLimit = 600;

    private readonly int _count;
    private readonly double[]? _distance;
    private readonly double[]? _duration;
    private readonly double[] _x;
    private readonly double[] _y;
    private readonly bool _rounded;
    private readonly double _timePerDistance;

    public DistanceRule Rule { get; }

    /// <summary>Detour factor applied to great-circle distances (1 for other rules).</summary>
    public double DetourFactor { get; }

    /// <summary>Time units per distance unit for coordinate rules (1 for Solomon; 60/speed for km and minutes).</summary>
    public double TimePerDistance => _timePerDistance;

    public int Count => _count;

    private TravelTable(DistanceRule rule, double[] x, double[] y, double timePerDistance, double detour, double[]? distance, double[]? duration)
    {
        Rule = rule;
        _x = x;
        _y = y;
        _count = x.Length;
        _timePerDistance = timePerDistance;
        DetourFactor = detour;
        _rounded = rule == DistanceRule.EuclideanRounded;
        _distance = distance;
        _duration = duration;
    }

    /// <summary>Planar coordinates; travel time is distance times <paramref name="timePerDistance"/>.</summary>
    public static TravelTable Planar(double[] x, double[] y, bool roundToInteger, double timePerDistance = 1.0)
    {
        var rule = roundToInteger ? DistanceRule.EuclideanRounded : DistanceRule.Euclidean;
        var table = new TravelTable(rule, x, y, timePerDistance, 1.0, null, null);
        return x.Length <= DenseLimit ? table.Densify() : table;
    }

    /// <summary>Latitude in <paramref name="lat"/>, longitude in <paramref name="lon"/>; km times detour, minutes at <paramref name="speedKmh"/>.</summary>
    public static TravelTable GreatCircleKm(double[] lat, double[] lon, double detourFactor, double speedKmh)
    {
        int n = lat.Length;
        var dist = new double[n * n];
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                dist[(i * n) + j] = i == j ? 0 : GreatCircle.Kilometres(lat[i], lon[i], lat[j], lon[j]) * detourFactor;
            }
        }

        double timePerKm = 60.0 / speedKmh;
        var dur = new double[n * n];
        for (int k = 0; k < dur.Length; k++)
        {
            dur[k] = dist[k] * timePerKm;
        }

        return new TravelTable(DistanceRule.GreatCircle, lat, lon, timePerKm, detourFactor, dist, dur);
    }

    /// <summary>Explicit row-major matrices of size count × count.</summary>
    public static TravelTable FromMatrix(double[] x, double[] y, double[] distance, double[] duration)
    {
        if (distance.Length != x.Length * x.Length || duration.Length != distance.Length)
        {
            throw new ArgumentException("Matrix sizes must be count × count.", nameof(distance));
        }

        return new TravelTable(DistanceRule.Matrix, x, y, 1.0, 1.0, distance, duration);
    }

    /// <summary>
    /// The same travel between a chosen list of this table's locations (entry i of the new table is location
    /// <paramref name="locations"/>[i] here): the residual instance of a re-plan keeps every arc as it was.
    /// </summary>
    public TravelTable Subset(int[] locations)
    {
        int n = locations.Length;
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            x[i] = _x[locations[i]];
            y[i] = _y[locations[i]];
        }

        if (!IsDense)
        {
            return new TravelTable(Rule, x, y, _timePerDistance, DetourFactor, null, null);
        }

        var dist = new double[n * n];
        var dur = new double[n * n];
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                dist[(i * n) + j] = Distance(locations[i], locations[j]);
                dur[(i * n) + j] = Duration(locations[i], locations[j]);
            }
        }

        return new TravelTable(Rule, x, y, _timePerDistance, DetourFactor, dist, dur);
    }

    private TravelTable Densify()
    {
        int n = _count;
        var dist = new double[n * n];
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                dist[(i * n) + j] = ComputePlanar(i, j);
            }
        }

        double[] dur;
        if (_timePerDistance == 1.0)
        {
            dur = dist;
        }
        else
        {
            dur = new double[n * n];
            for (int k = 0; k < dur.Length; k++)
            {
                dur[k] = dist[k] * _timePerDistance;
            }
        }

        return new TravelTable(Rule, _x, _y, _timePerDistance, 1.0, dist, dur);
    }

    public bool IsDense => _distance is not null;

    public double Distance(int from, int to)
    {
        var d = _distance;
        return d is not null ? d[(from * _count) + to] : ComputePlanar(from, to);
    }

    public double Duration(int from, int to)
    {
        var d = _duration;
        return d is not null ? d[(from * _count) + to] : ComputePlanar(from, to) * _timePerDistance;
    }

    /// <summary>Distance and duration of one arc, computing the geometry once when it is not stored.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    public void Arc(int from, int to, out double distance, out double duration)
    {
        var d = _distance;
        if (d is not null)
        {
            int k = (from * _count) + to;
            distance = d[k];
            duration = _duration![k];
        }
        else
        {
            distance = ComputePlanar(from, to);
            duration = distance * _timePerDistance;
        }
    }

    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private double ComputePlanar(int from, int to)
    {
        double dx = _x[from] - _x[to];
        double dy = _y[from] - _y[to];
        double e = Math.Sqrt((dx * dx) + (dy * dy));
        return _rounded ? Math.Round(e, MidpointRounding.AwayFromZero) : e;
    }
}
