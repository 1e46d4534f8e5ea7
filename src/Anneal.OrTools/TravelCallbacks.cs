using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>
/// Registers an arc function of locations with the routing model: as a dense matrix when the model is small
/// enough (OR-Tools evaluates it fastest), otherwise as a callback over Anneal's travel table, which needs no
/// memory per arc. Keeps the callbacks alive for as long as the native model may call them.
/// </summary>
internal sealed class TravelCallbacks
{
    private readonly RoutingModel _model;
    private readonly int[] _nodeLocation;
    private readonly int[] _indexLocation;
    private readonly bool _dense;
    private readonly List<LongLongToLong> _alive = [];

    public TravelCallbacks(RoutingModel model, RoutingIndexManager manager, int[] nodeLocation, bool dense)
    {
        _model = model;
        _nodeLocation = nodeLocation;
        _dense = dense;
        _indexLocation = new int[manager.GetNumberOfIndices()];
        for (int index = 0; index < _indexLocation.Length; index++)
        {
            _indexLocation[index] = nodeLocation[manager.IndexToNode(index)];
        }
    }

    /// <summary>The location (Anneal's index) of a routing index.</summary>
    public int LocationOf(long index) => _indexLocation[index];

    /// <summary>True when travel went to OR-Tools as matrices.</summary>
    public bool Dense => _dense;

    /// <summary>Registers <paramref name="value"/> (from location, to location); zero on the diagonal.</summary>
    public int Register(Func<int, int, long> value)
    {
        if (_dense)
        {
            int count = _nodeLocation.Length;
            var m = new long[count][];
            for (int a = 0; a < count; a++)
            {
                var row = new long[count];
                for (int b = 0; b < count; b++)
                {
                    row[b] = a == b ? 0 : value(_nodeLocation[a], _nodeLocation[b]);
                }

                m[a] = row;
            }

            return _model.RegisterTransitMatrix(m);
        }

        var locations = _indexLocation;
        LongLongToLong callback = (from, to) =>
        {
            int a = locations[from], b = locations[to];
            return a == b ? 0 : value(a, b);
        };
        _alive.Add(callback);
        return _model.RegisterTransitCallback(callback);
    }

    /// <summary>Call after the model's last use: until then the native side may call back.</summary>
    public void KeepAlive() => GC.KeepAlive(_alive);
}
