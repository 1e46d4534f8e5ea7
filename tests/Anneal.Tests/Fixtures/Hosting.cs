using Anneal.Cli;
using Anneal.Core.Solving;
using Anneal.Jobs;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Tests.Fixtures;

/// <summary>The services the `anneal` host registers, so tests reach solvers and the runner as the commands do.</summary>
internal static class Hosting
{
    public static SolverCatalog Catalog => CliServices.Shared.GetRequiredService<SolverCatalog>();

    public static JobRunner Runner => CliServices.Shared.GetRequiredService<JobRunner>();
}
