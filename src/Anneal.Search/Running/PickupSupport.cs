using Anneal.Core.Model;

namespace Anneal.Search.Running;

/// <summary>
/// Why Anneal's own search does not take a job with pickups yet: its incremental move evaluation counts every load as
/// leaving the depot and its moves place one stop at a time, so it would break pairs and misjudge loads along a route.
/// </summary>
public static class PickupSupport
{
    public static string? Declines(Instance instance) =>
        instance.HasPairs
            ? "the job has collect-and-deliver pairs, which this solver's moves do not yet keep on one vehicle, collection first; ortools takes them"
            : instance.HasPickups
                ? "the job has pickups, and this solver's load check does not yet follow the load along a route; ortools takes them"
                : null;
}
