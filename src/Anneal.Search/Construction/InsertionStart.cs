using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Anneal.Search.Neighbourhoods;

namespace Anneal.Search.Construction;

/// <summary>The cheapest-insertion plan the local searches start from, offered to other solvers as their start.</summary>
public sealed class InsertionStart : IStartPlan
{
    public Plan Build(Instance instance, CancellationToken cancel) =>
        InsertionSolver.Build(instance, new CandidateLists(instance, 30), cancel).ToPlan();
}
