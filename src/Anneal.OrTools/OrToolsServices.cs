using Anneal.Core.Solving;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.OrTools;

/// <summary>Offers "ortools", "exact" and "bound" to the host's solver catalogue: <c>services.AddAnneal().AddOrTools()</c>.</summary>
public static class OrToolsServices
{
    public static IServiceCollection AddOrTools(this IServiceCollection services)
    {
        services.AddSingleton(new SolverRegistration("ortools", () => new OrToolsSolver()));
        services.AddSingleton(new SolverRegistration("exact", () => new ExactSolver()));
        services.AddSingleton(new SolverRegistration("bound", () => new Bounds.BoundSolver()));
        return services;
    }
}
