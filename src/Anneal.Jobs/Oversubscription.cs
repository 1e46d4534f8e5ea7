using System.Globalization;

namespace Anneal.Jobs;

/// <summary>
/// The warning a run gets when it starts more searches than the machine has cores (solvers × threads, times the
/// jobs run at once): the budgets still hold, but every search gets only a share of a core, so it does less work in
/// its budget and its timing is not comparable with a run on a core of its own.
/// </summary>
public static class Oversubscription
{
    /// <param name="solvers">Solvers of one job.</param>
    /// <param name="threads">Searches per solver.</param>
    /// <param name="jobs">Jobs run at the same time.</param>
    /// <param name="cores">Processors the machine offers.</param>
    /// <returns>Null when every search has a core of its own.</returns>
    public static string? Warning(int solvers, int threads, int jobs, int cores)
    {
        long searches = (long)solvers * threads * jobs;
        if (searches <= cores)
        {
            return null;
        }

        string count = jobs > 1
            ? string.Create(CultureInfo.InvariantCulture, $"{jobs} jobs at once × {solvers} solver(s) × {threads} search(es) each = {searches:N0} searches")
            : string.Create(CultureInfo.InvariantCulture, $"{solvers} solver(s) × {threads} search(es) each = {searches:N0} searches");
        return string.Create(CultureInfo.InvariantCulture,
            $"{count} on {cores} core(s): they share the cores, so each search gets about {(double)cores / searches:0.##} of a core and does that much less work in its budget (the budget itself still holds; timings are not comparable with runs on a core each)");
    }
}
