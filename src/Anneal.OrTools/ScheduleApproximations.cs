using Anneal.Core.Model;

namespace Anneal.OrTools;

/// <summary>
/// What both OR-Tools models cannot copy from Anneal's scheduler. Anneal leaves at the shift start and then delays
/// departure only by the forward slack (no stop later than its window allows, no later return). OR-Tools chooses
/// any departure, so where a later departure could shorten the route — a stop with several windows, or a soft
/// window priced below the time it saves — its route duration may be shorter than Anneal's. That matters only
/// when duration costs something (per-hour cost, maximum duration).
/// </summary>
public static class ScheduleApproximations
{
    public static IReadOnlyList<string> For(Instance instance)
    {
        bool durationMatters = false;
        double timePrice = instance.Rules.MaxDuration.Hard ? 0 : instance.Rules.MaxDuration.Price;
        for (int k = 0; k < instance.Vehicles.Count; k++)
        {
            var v = instance.Vehicles[k];
            double hourly = instance.Costs.Rates(k).PerTime;
            durationMatters |= hourly > 0 || !double.IsPositiveInfinity(v.MaxDuration);
            timePrice = Math.Max(timePrice, hourly + (instance.Rules.MaxDuration.Hard ? 0 : instance.Rules.MaxDuration.Price));
        }

        if (!durationMatters)
        {
            return [];
        }

        bool severalWindows = !instance.SingleWindows;
        bool cheapLateness = !instance.Rules.TimeWindows.Hard && instance.Rules.TimeWindows.Price < timePrice;
        if (!severalWindows && !cheapLateness)
        {
            return [];
        }

        string why = severalWindows ? "stops with several windows" : "soft windows priced below driver time";
        return [$"approximated: route duration — with {why}, the solver may choose a later departure than Anneal's schedule (which leaves at the shift start plus forward slack); its routes are re-costed by Anneal's evaluator"];
    }
}
