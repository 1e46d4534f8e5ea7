using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Core.Solving;

/// <summary>
/// A quick first plan for solvers that start from one (the OR-Tools adapters start from Anneal's construction);
/// the host provides it, so an adapter needs no reference to the search library.
/// </summary>
public interface IStartPlan
{
    /// <summary>A plan for every stop it can place; cancellation ends it early with the stops placed so far.</summary>
    Plan Build(Instance instance, CancellationToken cancel);
}
