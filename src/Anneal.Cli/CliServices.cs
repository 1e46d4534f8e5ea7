using Anneal.Jobs;
using Anneal.OrTools;
using Anneal.Reports;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Cli;

/// <summary>What the `anneal` host offers every command and the worker: all solvers, every run file, the pictures.</summary>
public static class CliServices
{
    private static readonly Lazy<ServiceProvider> SharedProvider = new(() => Build(), LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>One provider for the process: its services are immutable singletons, safe to share between commands and tests.</summary>
    public static IServiceProvider Shared => SharedProvider.Value;

    public static IServiceCollection AddAnnealHost(this IServiceCollection services) =>
        services.AddAnneal().AddOrTools().AddPictures();

    public static ServiceProvider Build() => new ServiceCollection().AddAnnealHost().BuildServiceProvider();
}
