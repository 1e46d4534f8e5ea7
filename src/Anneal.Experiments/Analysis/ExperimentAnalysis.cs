using Anneal.Experiments.Statistics;

namespace Anneal.Experiments.Analysis;

/// <summary>
/// Gaps, per-solver statistics, best counts and paired Wilcoxon comparisons of a results table. An instance's value for a
/// solver and budget is its mean gap over the feasible seeds; a run that breaks a hard rule has no gap and counts only as infeasible.
/// </summary>
public static class ExperimentAnalysis
{
    private const double Tie = 1e-9;

    public static ExperimentStatistics Compute(IReadOnlyList<BenchRow> rows)
    {
        var gaps = Gaps(rows, out var withoutReference);
        var solvers = rows.Select(r => r.Solver).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
        var budgets = rows.Select(r => r.BudgetSeconds).Distinct().Order().ToList();
        var configs = new List<ConfigStats>();
        var pairs = new List<PairComparison>();
        foreach (double budget in budgets)
        {
            // instance → solver → mean gap over feasible seeds
            var means = InstanceMeans(gaps.Where(g => g.Row.BudgetSeconds == budget));
            var best = new Dictionary<string, int>(StringComparer.Ordinal);
            foreach (var (_, bySolver) in means)
            {
                double min = bySolver.Values.Min();
                foreach (var (solver, mean) in bySolver)
                {
                    if (mean <= min + Tie)
                    {
                        best[solver] = best.GetValueOrDefault(solver) + 1;
                    }
                }
            }

            foreach (var solver in solvers)
            {
                var mine = gaps.Where(g => g.Row.BudgetSeconds == budget && g.Row.Solver == solver).ToList();
                if (mine.Count == 0)
                {
                    continue;
                }

                var values = mine.Where(g => g.Gap is not null).Select(g => g.Gap!.Value).ToList();
                configs.Add(new ConfigStats(solver, budget, mine.Count, mine.Count(g => g.Row.Feasible), Spread.Of(values),
                    best.GetValueOrDefault(solver), mine.Select(g => g.Row.Instance).Distinct(StringComparer.Ordinal).Count()));
            }

            for (int i = 0; i < solvers.Count; i++)
            {
                for (int j = i + 1; j < solvers.Count; j++)
                {
                    var a = new List<double>();
                    var b = new List<double>();
                    foreach (var (_, bySolver) in means)
                    {
                        if (bySolver.TryGetValue(solvers[i], out double x) && bySolver.TryGetValue(solvers[j], out double y))
                        {
                            a.Add(x);
                            b.Add(y);
                        }
                    }

                    if (a.Count > 0)
                    {
                        pairs.Add(new PairComparison(budget, solvers[i], solvers[j], WilcoxonSignedRank.Test(a, b)));
                    }
                }
            }
        }

        int instances = rows.Select(r => r.Instance).Distinct(StringComparer.Ordinal).Count();
        return new ExperimentStatistics(gaps, configs, pairs, withoutReference, instances);
    }

    /// <summary>
    /// The value a gap measures, as results.csv's gap_pct does: the objective under `cost`, the distance under the
    /// benchmark objectives (whose reference values are distances).
    /// </summary>
    public static double Measure(BenchRow row) => row.Objective == "cost" ? row.ObjectiveValue : row.Distance;

    /// <summary>Gap of every run: to the reference when results.csv has one, else to the best feasible measure of the experiment for that instance and objective.</summary>
    public static IReadOnlyList<RunGap> Gaps(IReadOnlyList<BenchRow> rows, out IReadOnlyList<string> withoutReference)
    {
        var best = BestFeasible(rows, Measure);
        var missing = new SortedSet<string>(StringComparer.Ordinal);
        var result = new List<RunGap>(rows.Count);
        foreach (var row in rows)
        {
            if (row.Reference is not null && row.GapPercent is { } gap)
            {
                result.Add(new RunGap(row, row.Feasible ? gap : null, true));
                continue;
            }

            missing.Add($"{row.Instance} ({row.Objective})");
            double? own = null;
            if (row.Feasible && best.TryGetValue((row.Instance, row.Objective), out double b) && Math.Abs(b) > 1e-12)
            {
                own = (Measure(row) / b - 1) * 100;
            }

            result.Add(new RunGap(row, own, false));
        }

        withoutReference = missing.ToList();
        return result;
    }

    /// <summary>Least value of <paramref name="measure"/> over the feasible runs of each instance and objective.</summary>
    public static Dictionary<(string Instance, string Objective), double> BestFeasible(IEnumerable<BenchRow> rows, Func<BenchRow, double> measure)
    {
        var best = new Dictionary<(string, string), double>();
        foreach (var row in rows)
        {
            if (!row.Feasible || !double.IsFinite(measure(row)))
            {
                continue;
            }

            var key = (row.Instance, row.Objective);
            best[key] = best.TryGetValue(key, out double b) ? Math.Min(b, measure(row)) : measure(row);
        }

        return best;
    }

    private static SortedDictionary<string, Dictionary<string, double>> InstanceMeans(IEnumerable<RunGap> gaps)
    {
        var sums = new SortedDictionary<string, Dictionary<string, (double Sum, int Count)>>(StringComparer.Ordinal);
        foreach (var g in gaps)
        {
            if (g.Gap is not { } gap)
            {
                continue;
            }

            string key = $"{g.Row.Instance}\u0001{g.Row.Objective}";
            if (!sums.TryGetValue(key, out var bySolver))
            {
                sums[key] = bySolver = new(StringComparer.Ordinal);
            }

            var (s, c) = bySolver.GetValueOrDefault(g.Row.Solver);
            bySolver[g.Row.Solver] = (s + gap, c + 1);
        }

        var means = new SortedDictionary<string, Dictionary<string, double>>(StringComparer.Ordinal);
        foreach (var (key, bySolver) in sums)
        {
            means[key] = bySolver.ToDictionary(p => p.Key, p => p.Value.Sum / p.Value.Count, StringComparer.Ordinal);
        }

        return means;
    }
}
