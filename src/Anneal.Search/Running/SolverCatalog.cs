using Anneal.Core.Model;
using Anneal.Search.Construction;

namespace Anneal.Search.Running;

/// <summary>The solvers this library knows, by the names users type.</summary>
public static class SolverCatalog
{
    private static readonly Dictionary<string, Func<ISolver>> Factories = new(StringComparer.OrdinalIgnoreCase)
    {
        ["insertion"] = () => new InsertionSolver(),
        ["sa"] = () => new Annealing.SimulatedAnnealing(),
        ["tabu"] = () => new Tabu.TabuSearch(),
    };

    /// <summary>Register a solver that lives in another assembly (OR-Tools adapters register themselves from the host).</summary>
    public static void Register(string name, Func<ISolver> factory) => Factories[name] = factory;

    public static IReadOnlyCollection<string> Names => Factories.Keys;

    public static bool Exists(string name) => Factories.ContainsKey(name);

    public static ISolver Create(string name) =>
        Factories.TryGetValue(name, out var f) ? f() : throw new ArgumentException($"unknown solver '{name}'; known: {string.Join(", ", Factories.Keys)}", nameof(name));

    /// <summary>Solvers run when the user names none.</summary>
    public static IReadOnlyList<string> Defaults(Instance instance)
    {
        var list = new List<string>();
        foreach (var name in new[] { "sa", "tabu", "ortools", "exact", "bound" })
        {
            if (Factories.ContainsKey(name) && (name != "exact" || instance.StopCount <= 30) && (name != "bound" || instance.StopCount > 0))
            {
                list.Add(name);
            }
        }

        if (list.Count == 0)
        {
            list.Add("insertion");
        }

        return list;
    }
}
