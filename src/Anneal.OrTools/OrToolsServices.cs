using Anneal.Core.Solving;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.OrTools;

/// <summary>Offers "ortools", "exact" and "bound" to the host's solver catalogue: <c>services.AddAnneal().AddOrTools()</c>.</summary>
public static class OrToolsServices
{
    public static IServiceCollection AddOrTools(this IServiceCollection services)
    {
        // Both start from the host's first plan (Anneal's construction) when it offers one.
        services.AddSingleton(sp => new SolverRegistration("ortools", () => new OrToolsSolver(start: sp.GetService<IStartPlan>())));
        services.AddSingleton(sp => new SolverRegistration("exact", () => new ExactSolver(start: sp.GetService<IStartPlan>())));
        services.AddSingleton(new SolverRegistration("bound", () => new Bounds.BoundSolver()));
        return services;
    }
}
