using Anneal.Core.Solving;
using Anneal.Formats.Output.Artifacts;
using Anneal.Search.Annealing;
using Anneal.Search.Construction;
using Anneal.Search.Tabu;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace Anneal.Jobs;

/// <summary>
/// What a host registers to run jobs: Anneal's own solvers (insertion, sa, tabu), the catalogue built from every
/// <see cref="SolverRegistration"/> (adapters add theirs: <c>services.AddAnneal().AddOrTools()</c>), the job runner,
/// and the file writers of a run (routes.csv, summary.json, trace.csv, run.json; pictures are added by the host).
/// </summary>
public static class AnnealServices
{
    public static IServiceCollection AddAnneal(this IServiceCollection services)
    {
        services.AddSolver("insertion", () => new InsertionSolver(), byDefault: false);
        services.AddSolver("sa", () => new SimulatedAnnealing());
        services.AddSolver("tabu", () => new TabuSearch());
        services.TryAddSingleton<IStartPlan, InsertionStart>();
        services.TryAddSingleton(sp => new SolverCatalog(sp.GetServices<SolverRegistration>()));
        services.TryAddSingleton<JobRunner>();
        services.TryAddSingleton<RunWriter>();
        services.AddArtifact<RoutesCsvArtifact>();
        services.AddArtifact<ChangesCsvArtifact>();
        services.AddArtifact<RoutesGeoJsonArtifact>();
        services.AddArtifact<SummaryJsonArtifact>();
        services.AddArtifact<TraceCsvArtifact>();
        services.AddArtifact<RunRecordArtifact>();
        return services;
    }

    /// <summary>Offers a solver under <paramref name="name"/>; registration order is the order defaults run in.</summary>
    public static IServiceCollection AddSolver(this IServiceCollection services, string name, Func<ISolver> create, bool byDefault = true) =>
        services.AddSingleton(new SolverRegistration(name, create, byDefault));

    /// <summary>Adds a file writer to every run; writers run in registration order.</summary>
    public static IServiceCollection AddArtifact<T>(this IServiceCollection services)
        where T : class, IRunArtifact =>
        services.AddSingleton<IRunArtifact, T>();
}
