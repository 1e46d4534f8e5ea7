using Anneal.Reports.Traces;

namespace Anneal.Experiments.Analysis;

/// <summary>
/// Time-to-target curves: per solver, at its longest budget, the fraction of runs whose best feasible plan came within
/// x% of the reference by time t (the empirical distribution of times to target; cf. Aiex, Resende &amp; Ribeiro 2002,
/// "Probability distribution of solution time in GRASP", J. Heuristics 8:343-373). Shorter budgets are left out: their
/// runs are shorter copies of the same search and would crowd the picture.
/// </summary>
public static class TimeToTarget
{
    public static readonly double[] DefaultPercents = [1, 2, 5];

    public static IReadOnlyList<TargetSeries> Compute(IReadOnlyList<TracedRun> runs, IReadOnlyList<double> percents)
    {
        var series = new List<TargetSeries>();
        foreach (var bySolver in runs.GroupBy(r => r.Row.Solver, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            double budget = bySolver.Max(r => r.Row.BudgetSeconds);
            var mine = bySolver.Where(r => r.Row.BudgetSeconds == budget).ToList();
            foreach (double percent in percents)
            {
                var times = new List<double>();
                foreach (var run in mine)
                {
                    if (TraceFacts.SecondsToWithin(run.Trace, run.Reference, feasible: true, percent / 100) is { } t)
                    {
                        times.Add(t);
                    }
                }

                times.Sort();
                series.Add(new TargetSeries(bySolver.Key, budget, percent, times, mine.Count));
            }
        }

        return series;
    }
}
