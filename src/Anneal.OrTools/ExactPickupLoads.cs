using Anneal.Core.Model;
using Google.OrTools.Sat;

namespace Anneal.OrTools;

/// <summary>
/// The exact model's load on board for jobs with pickups (capacity hard): per stop, what is still on board for later
/// stops of the route (its depot load) and what has been collected so far (returns and a pair's goods), both carried
/// along the true arcs; their sum within the vehicle's capacity after every stop and, at the depot, the departure
/// load. Collect-and-deliver pairs share a route id (the first stop of their route) and a collection's position on
/// it comes before its delivery's. A common formulation of the pickup-and-delivery problem (load and precedence as
/// resource variables on arcs); written from the model, not from a paper.
/// </summary>
internal sealed class ExactPickupLoads
{
    private readonly CpModel _model;
    private readonly Instance _instance;
    private readonly long[,] _depotLoad;
    private readonly long[,] _change;
    private readonly IntVar[,] _onBoardForLater;
    private readonly IntVar[,] _collected;
    private readonly IntVar[]? _route;
    private readonly IntVar[]? _position;

    public ExactPickupLoads(CpModel model, Instance instance, IntegerScale scale)
    {
        _model = model;
        _instance = instance;
        int n = instance.StopCount, dims = instance.DimensionCount;
        _depotLoad = new long[n, dims];
        _change = new long[n, dims];
        var totalDepot = new long[dims];
        var totalCollected = new long[dims];
        for (int i = 0; i < n; i++)
        {
            for (int d = 0; d < dims; d++)
            {
                // A pair's delivery unloads what its collection took on: the same rounded amount on both sides.
                long pairDelivery = instance.Partner(i) >= 0 && !instance.IsCollection(i) ? scale.DemandUp(instance.Demand(i, d)) : 0;
                _depotLoad[i, d] = pairDelivery > 0 ? 0 : scale.DemandUp(instance.DepotLoad(i, d));
                _change[i, d] = scale.DemandUp(instance.Pickup(i, d)) - pairDelivery;
                totalDepot[d] += _depotLoad[i, d];
                totalCollected[d] += scale.DemandUp(instance.Pickup(i, d));
            }
        }

        _onBoardForLater = new IntVar[n, dims];
        _collected = new IntVar[n, dims];
        for (int i = 0; i < n; i++)
        {
            for (int d = 0; d < dims; d++)
            {
                _onBoardForLater[i, d] = model.NewIntVar(0, totalDepot[d], $"later{i}.{d}");
                _collected[i, d] = model.NewIntVar(0, totalCollected[d], $"collected{i}.{d}");
            }
        }

        if (!instance.HasPairs)
        {
            return;
        }

        _route = new IntVar[n];
        _position = new IntVar[n];
        for (int i = 0; i < n; i++)
        {
            _route[i] = model.NewIntVar(0, n - 1, "route" + i);
            _position[i] = model.NewIntVar(1, n, "position" + i);
        }

        for (int c = 0; c < n; c++)
        {
            if (instance.IsCollection(c))
            {
                int d = instance.Partner(c);
                model.Add(_route[c] == _route[d]);
                model.Add(_position[c] < _position[d]);
            }
        }
    }

    /// <summary>Arc from the depot to stop j, of a vehicle with these capacities (scaled, rounded down).</summary>
    public void Start(int j, ILiteral x, long[] capacity)
    {
        for (int d = 0; d < capacity.Length; d++)
        {
            _model.Add(_collected[j, d] == _change[j, d]).OnlyEnforceIf(x);
            _model.Add(_onBoardForLater[j, d] + _depotLoad[j, d] <= capacity[d]).OnlyEnforceIf(x);
        }

        if (_route is not null)
        {
            _model.Add(_route[j] == j).OnlyEnforceIf(x);
            _model.Add(_position![j] == 1).OnlyEnforceIf(x);
        }
    }

    /// <summary>Arc from stop i to stop j.</summary>
    public void Arc(int i, int j, ILiteral x)
    {
        for (int d = 0; d < _instance.DimensionCount; d++)
        {
            _model.Add(_onBoardForLater[i, d] == _onBoardForLater[j, d] + _depotLoad[j, d]).OnlyEnforceIf(x);
            _model.Add(_collected[j, d] == _collected[i, d] + _change[j, d]).OnlyEnforceIf(x);
        }

        if (_route is not null)
        {
            _model.Add(_route[j] == _route[i]).OnlyEnforceIf(x);
            _model.Add(_position![j] == _position[i] + 1).OnlyEnforceIf(x);
        }
    }

    /// <summary>Arc from stop i back to the depot: nothing for later stops is left on board.</summary>
    public void Return(int i, ILiteral x)
    {
        for (int d = 0; d < _instance.DimensionCount; d++)
        {
            _model.Add(_onBoardForLater[i, d] == 0).OnlyEnforceIf(x);
        }
    }

    /// <summary>Stop i served by a vehicle with these capacities: the load on board after it fits.</summary>
    public void Served(int i, ILiteral served, long[] capacity)
    {
        for (int d = 0; d < capacity.Length; d++)
        {
            _model.Add(_onBoardForLater[i, d] + _collected[i, d] <= capacity[d]).OnlyEnforceIf(served);
        }
    }
}
