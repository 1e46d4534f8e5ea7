using Anneal.Core.Model;

namespace Anneal.OrTools;

/// <summary>
/// Drivers' hours are not in the OR-Tools models: the routing library's break intervals and CP-SAT could hold them, but
/// neither model is written yet, and a plan without its breaks would look legal when it is not. Both solvers decline a
/// job with driving rules, so it goes to Anneal's own solvers, whose evaluator plans the breaks. The bound stays valid
/// (breaks only add time) and still runs.
/// </summary>
internal static class DrivingRulesSupport
{
    public static string? Declines(Instance instance)
    {
        foreach (var v in instance.Vehicles)
        {
            if (v.DrivingRules is { } rules)
            {
                return $"vehicle {v.Id} works under driving rules ({rules.Name}); this model has no breaks or driving limits yet, so sa, tabu and insertion plan the job";
            }
        }

        return null;
    }
}
