using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Solving;

namespace Anneal.Jobs;

/// <summary>
/// Keeps a whole run inside its budget: start-up, reading, solving, judging and writing together end within
/// T + max(2 s, 5% of T) of wall time. The solvers get T less what reading took and what writing the files is
/// expected to take beyond that tolerance; on small jobs that is nothing, on 10,000 stops a few seconds.
/// </summary>
public static class WallClockBudget
{
    /// <summary>Seconds for judging the plans, joining the solvers and ending the process.</summary>
    private const double Closing = 0.5;

    /// <summary>What a run may exceed its budget by: max(2 s, 5% of it).</summary>
    public static double Tolerance(double seconds) => Math.Max(2, 0.05 * seconds);

    /// <summary>
    /// Seconds to write a run's files (routes.csv, summary.json, trace.csv, run.json, the pictures and the report),
    /// measured on one core of the development machine: about 0.5 s, plus a quarter of a millisecond per stop and per
    /// vehicle (3 s at 10,000 stops, mostly the schedule chart and the route map).
    /// </summary>
    public static double OutputSeconds(Instance instance) => 0.5 + (0.25e-3 * (instance.StopCount + instance.Vehicles.Count));

    /// <summary>
    /// How long a solver may run past its own budget before it stops: about a second for the OR-Tools adapters
    /// (their native search is stopped from outside), a tenth for Anneal's own searches.
    /// </summary>
    public static double Overrun(IReadOnlyList<ISolver> solvers) => solvers.Any(s => s.Name is "ortools" or "exact" or "bound") ? 1.0 : 0.1;

    /// <summary>The solvers' share of a budget of <paramref name="seconds"/>, of which <paramref name="spent"/> has gone already.</summary>
    public static TimeSpan SolverShare(double seconds, TimeSpan spent, Instance instance, IReadOnlyList<ISolver> solvers)
    {
        double kept = spent.TotalSeconds + OutputSeconds(instance) + Closing + Overrun(solvers) - Tolerance(seconds);
        double share = seconds - Math.Max(0, kept);
        return TimeSpan.FromSeconds(Math.Max(Math.Min(seconds, 0.25), share));
    }

    /// <summary>The note a run carries when its solvers got less than the whole budget.</summary>
    public static string? Note(double seconds, TimeSpan share, Instance instance)
    {
        double kept = seconds - share.TotalSeconds;
        return kept < 0.05 ? null : string.Create(CultureInfo.InvariantCulture,
            $"the solvers had {share.TotalSeconds:0.0} s of the {seconds:0.#} s budget: {kept:0.0} s were kept for start-up, reading and writing {instance.StopCount:N0} stops, so that the run ends within the budget and its {Tolerance(seconds):0.#} s tolerance");
    }
}
