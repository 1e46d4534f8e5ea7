namespace Anneal.Experiments.Analysis;

/// <summary>
/// Performance profiles (Dolan &amp; Moré 2002, Mathematical Programming 91:201-213) over solution quality: the
/// performance of a run is its objective value, each solver-and-budget pair is a "solver", and the best is taken over
/// every run on the instance (all solvers, seeds and budgets) under the same objective. With one seed the fraction of
/// runs within τ is the fraction of instances; with several it is the fraction of instance-and-seed runs.
/// </summary>
public static class PerformanceProfile
{
    public static IReadOnlyList<ProfileSeries> Compute(IReadOnlyList<BenchRow> rows)
    {
        var best = ExperimentAnalysis.BestFeasible(rows, r => r.ObjectiveValue);
        var groups = new SortedDictionary<(string Solver, double Budget), List<double>>(Comparer<(string Solver, double Budget)>.Create((x, y) =>
        {
            int c = string.CompareOrdinal(x.Solver, y.Solver);
            return c != 0 ? c : x.Budget.CompareTo(y.Budget);
        }));
        foreach (var row in rows)
        {
            var key = (row.Solver, row.BudgetSeconds);
            if (!groups.TryGetValue(key, out var ratios))
            {
                groups[key] = ratios = [];
            }

            ratios.Add(Ratio(row, best));
        }

        var series = new List<ProfileSeries>();
        foreach (var ((solver, budget), ratios) in groups)
        {
            ratios.Sort();
            series.Add(new ProfileSeries(solver, budget, ratios));
        }

        return series;
    }

    private static double Ratio(BenchRow row, Dictionary<(string Instance, string Objective), double> best)
    {
        if (!row.Feasible || !best.TryGetValue((row.Instance, row.Objective), out double b))
        {
            return double.PositiveInfinity;
        }

        // A zero best (nothing to pay) makes ratios meaningless: equal is 1, anything worse never within τ.
        if (b <= 1e-12)
        {
            return row.ObjectiveValue <= b + 1e-12 ? 1 : double.PositiveInfinity;
        }

        return row.ObjectiveValue / b;
    }
}
