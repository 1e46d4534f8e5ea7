using Anneal.Core.Model;

namespace Anneal.Search.Running;

/// <summary>
/// Why Anneal's own search does not take a job with collect-and-deliver pairs yet: its moves place one stop at a time,
/// so they would split pairs. Returns (pickups that ride to the depot) it takes: the move evaluation follows the load
/// along each route (<see cref="Representation.LoadCache"/>).
/// </summary>
public static class PickupSupport
{
    public static string? Declines(Instance instance) =>
        instance.HasPairs
            ? "the job has collect-and-deliver pairs, which this solver's moves do not yet keep on one vehicle, collection first; ortools takes them"
            : null;
}
