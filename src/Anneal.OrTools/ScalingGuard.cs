using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.OrTools;

/// <summary>
/// Checks, before any native call, that the integers a model hands to OR-Tools or CP-SAT fit comfortably in 64 bits:
/// the time horizon, every trip, the total demand and each capacity per dimension, the longest arc's cost and a bound
/// on the whole objective, all at the scale in use. Native code aborts the process on an overflow it detects
/// ("Check failed") and misbehaves on one it does not, so a model that does not fit is declined with a reason instead.
/// The readers' ranges (<c>Limits</c>) keep every job read from a file well inside; this guards instances built
/// any other way.
/// </summary>
public static class ScalingGuard
{
    /// <summary>
    /// Largest scaled value accepted: a thousandth of int64's range, so the sums the libraries form over a route or a
    /// plan (thousands of such values) cannot overflow, and every value is still exact in a double (below 2^53).
    /// </summary>
    public const double MaxSteps = 1e15;

    /// <exception cref="ScalingDeclinedException">when some scaled value would not fit.</exception>
    public static void Ensure(Instance instance, IntegerScale scale)
    {
        if (Check(instance, scale) is { } reason)
        {
            throw new ScalingDeclinedException(reason);
        }
    }

    /// <summary>The result of a solver that declined the model: no plan, and the reason as its status.</summary>
    public static SolverResult Declined(string solver, ScalingDeclinedException e) =>
        SolverResult.Declined(solver, "the model does not fit the solver's integers: " + e.Message);

    /// <summary>Null when the model fits; otherwise why not, in words for the summary.</summary>
    public static string? Check(Instance instance, IntegerScale scale)
    {
        if (!Fits(scale.HorizonSteps))
        {
            return $"its times span {Shown(scale.HorizonSteps)} integer steps at {Shown(scale.TimeScale)} steps per time unit (windows, shifts, services and the longest trips added up), above the {Shown(MaxSteps)} the 64-bit solver can take";
        }

        if (GappedWindowSpan(instance, scale) is { } gapped && gapped.Span > MaxGappedSpan)
        {
            return $"stop {instance.Stops[gapped.Stop].Id} has several windows and its times span {Shown(gapped.Span)} integer steps, above the {Shown(MaxGappedSpan)} over which OR-Tools can remove the gaps between windows";
        }

        var (distance, duration) = LongestTrip(instance);
        if (!double.IsFinite(distance) || !double.IsFinite(duration))
        {
            return "a travel distance or duration is not a finite number";
        }

        double rate = 1;
        foreach (var v in instance.Vehicles)
        {
            rate = Math.Max(rate, v.CostPerDistance);
        }

        if (!Fits(distance * rate * scale.CostScale))
        {
            return $"its longest trip ({Shown(distance)}) at the dearest cost per distance ({Shown(rate)}) is {Shown(distance * rate * scale.CostScale)} integer cost steps, above {Shown(MaxSteps)}";
        }

        for (int d = 0; d < instance.DimensionCount; d++)
        {
            double total = 0;
            for (int s = 0; s < instance.StopCount; s++)
            {
                total += instance.Demand(s, d);
            }

            string dimension = instance.DimensionNames[d];
            if (!Fits(total * scale.LoadScale))
            {
                return $"the total demand in {dimension} ({Shown(total)}) is {Shown(total * scale.LoadScale)} integer load steps, above {Shown(MaxSteps)}";
            }

            for (int v = 0; v < instance.Vehicles.Count; v++)
            {
                double capacity = instance.Capacity(v, d);
                if (!double.IsPositiveInfinity(capacity) && !Fits(capacity * scale.LoadScale))
                {
                    return $"vehicle {instance.Vehicles[v].Id}'s capacity in {dimension} ({Shown(capacity)}) is {Shown(capacity * scale.LoadScale)} integer load steps, above {Shown(MaxSteps)}";
                }
            }
        }

        if (!Fits(scale.ObjectiveBound * scale.CostScale))
        {
            return $"a plan's objective may reach {Shown(scale.ObjectiveBound)} (fixed costs, trips, hours and penalties added up), above the {Shown(MaxSteps)} integer cost steps the solver can take";
        }

        return null;
    }

    /// <summary>
    /// OR-Tools removes the gaps between a stop's windows from a time variable only when its range spans at most
    /// 2^32 - 1 values (a bitset; beyond that it aborts: "Bitset too large"). The range is the one
    /// <see cref="RoutingModelBuilder"/> gives the stop: from its first opening to its last close (hard windows) or the horizon (soft).
    /// </summary>
    public const double MaxGappedSpan = uint.MaxValue;

    private static (int Stop, double Span)? GappedWindowSpan(Instance instance, IntegerScale scale)
    {
        (int, double)? widest = null;
        bool hard = instance.Rules.TimeWindows.Hard;
        for (int s = 0; s < instance.StopCount; s++)
        {
            var windows = instance.Stops[s].Windows;
            if (windows.Length < 2)
            {
                continue;
            }

            double span = (double)(hard ? scale.TimeDown(windows[^1].Close) : scale.Horizon) - scale.TimeUp(windows[0].Open);
            if (widest is not { } w || span > w.Item2)
            {
                widest = (s, span);
            }
        }

        return widest;
    }

    private static bool Fits(double steps) => double.IsFinite(steps) && Math.Abs(steps) <= MaxSteps;

    private static (double Distance, double Duration) LongestTrip(Instance instance)
    {
        double distance = 0, duration = 0;
        int n = instance.Travel.Count;
        for (int a = 0; a < n; a++)
        {
            for (int b = 0; b < n; b++)
            {
                // Max ignores neither NaN nor infinity: either makes the result non-finite, which is what is checked.
                distance = Math.Max(distance, instance.Travel.Distance(a, b));
                duration = Math.Max(duration, instance.Travel.Duration(a, b));
            }
        }

        return (distance, duration);
    }

    private static string Shown(double v) =>
        Math.Abs(v) >= 1e6 || double.IsInfinity(v) ? v.ToString("0.#E+0", CultureInfo.InvariantCulture) : v.ToString("0.###", CultureInfo.InvariantCulture);
}

/// <summary>The model would not fit the native solver's integers; <see cref="Exception.Message"/> says why.</summary>
public sealed class ScalingDeclinedException : Exception
{
    public ScalingDeclinedException(string reason)
        : base(reason)
    {
    }

    public ScalingDeclinedException()
    {
    }

    public ScalingDeclinedException(string message, Exception inner)
        : base(message, inner)
    {
    }
}
