using Anneal.Core.Model;
using Anneal.Core.Plans;
using Google.OrTools.ConstraintSolver;

namespace Anneal.OrTools;

/// <summary>
/// A built OR-Tools routing model and the way back: node n &lt; StopCount is stop n, later nodes are the depots
/// some vehicle uses (an unused depot would otherwise become a place to visit).
/// </summary>
public sealed class RoutingMapping : IDisposable
{
    private readonly TravelCallbacks _travel;
    private readonly Func<int, int, long>[] _arcCost;

    internal RoutingMapping(Instance instance, IntegerScale scale, RoutingIndexManager manager, RoutingModel model, TravelCallbacks travel, Func<int, int, long>[] arcCost, IReadOnlyList<string> notes)
    {
        _travel = travel;
        _arcCost = arcCost;
        Instance = instance;
        Scale = scale;
        Manager = manager;
        Model = model;
        Notes = notes;
    }

    public Instance Instance { get; }
    public IntegerScale Scale { get; }
    public RoutingIndexManager Manager { get; }
    public RoutingModel Model { get; }

    /// <summary>Rules expressed only approximately ("approximated: ...") and other facts a user should know.</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>True when travel went to OR-Tools as dense matrices, false for callbacks over the travel table.</summary>
    public bool DenseTravel => _travel.Dense;

    /// <summary>The scaled arc cost vehicle <paramref name="vehicle"/> pays between two routing indices, as given to OR-Tools.</summary>
    public long ArcCost(int vehicle, long from, long to) =>
        _arcCost[vehicle](_travel.LocationOf(from), _travel.LocationOf(to));

    /// <summary>The plan in the model's current solution (inside an at-solution callback).</summary>
    public Plan CurrentPlan() => ReadPlan(index => Model.NextVar(index).Value());

    public Plan ToPlan(Assignment solution) => ReadPlan(index => solution.Value(Model.NextVar(index)));

    /// <summary>The plan as OR-Tools routes (stop indices per vehicle), for ReadAssignmentFromRoutes.</summary>
    public long[][] ToRoutes(Plan plan)
    {
        var routes = new long[Instance.Vehicles.Count][];
        for (int v = 0; v < routes.Length; v++)
        {
            routes[v] = [];
        }

        foreach (var route in plan.Routes)
        {
            var indices = new long[route.Stops.Length];
            for (int k = 0; k < indices.Length; k++)
            {
                indices[k] = Manager.NodeToIndex(route.Stops[k]);
            }

            routes[route.Vehicle] = indices;
        }

        return routes;
    }

    /// <summary>Frees the native model (the model before the manager it refers to).</summary>
    public void Dispose()
    {
        _travel.KeepAlive();
        Model.Dispose();
        Manager.Dispose();
    }

    private Plan ReadPlan(Func<long, long> next)
    {
        var routes = new List<PlannedRoute>();
        var stops = new List<int>();
        for (int v = 0; v < Instance.Vehicles.Count; v++)
        {
            stops.Clear();
            long index = next(Model.Start(v));
            while (!Model.IsEnd(index))
            {
                stops.Add(Manager.IndexToNode(index));
                index = next(index);
            }

            if (stops.Count > 0)
            {
                routes.Add(new PlannedRoute(v, stops.ToArray()));
            }
        }

        return new Plan(routes);
    }
}
