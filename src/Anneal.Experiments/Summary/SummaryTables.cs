using System.Globalization;
using Anneal.Experiments.Analysis;
using Anneal.Formats.Output;

namespace Anneal.Experiments.Summary;

/// <summary>The statistics as tables: the same cells go to the console, summary.md, summary.html and the CSV files.</summary>
public static class SummaryTables
{
    public static SummaryTable Configs(ExperimentStatistics stats) => new(
        ["solver", "budget", "runs", "feasible", "median gap", "IQR (Q1 – Q3)", "mean gap [95% CI]", "best on"],
        stats.Configs.Select(c => (IReadOnlyList<string>)
        [
            c.Solver, Seconds(c.Budget), I(c.Runs), I(c.Feasible), Pct(c.Gap.Median),
            c.Gap.Count == 0 ? "n/a" : $"{Pct(c.Gap.Iqr)} ({Pct(c.Gap.Q1)} – {Pct(c.Gap.Q3)})",
            c.Gap.Count == 0 ? "n/a" : c.Gap.Count < 2 ? $"{Pct(c.Gap.Mean)} [n/a]" : $"{Pct(c.Gap.Mean)} [{Pct(c.Gap.CiLow)}, {Pct(c.Gap.CiHigh)}]",
            $"{I(c.BestCount)} of {I(c.Instances)}",
        ]).ToList(),
        [false, true, true, true, true, true, true, true]);

    public static SummaryTable Pairs(ExperimentStatistics stats) => new(
        ["budget", "A", "B", "instances", "median A − B", "W+", "W−", "p (two-sided)", "method", "verdict"],
        stats.Pairs.Select(p => (IReadOnlyList<string>)
        [
            Seconds(p.Budget), p.A, p.B, I(p.Test.Pairs + p.Test.Zeros), Pct(p.Test.MedianDifference), N(p.Test.WPlus), N(p.Test.WMinus),
            double.IsNaN(p.Test.PValue) ? "n/a" : p.Test.PValue.ToString("0.0000", CultureInfo.InvariantCulture),
            p.Test.Exact ? "exact" : "normal approx.", p.Verdict(),
        ]).ToList(),
        [true, false, false, true, true, true, true, true, false, false]);

    /// <summary>
    /// Per instance and objective, the strongest proven lower bound of any run and how it compares: with the reference
    /// (bound ÷ reference; not under vehicles-then-distance, whose references are distances) and with the best plan that
    /// keeps the hard rules (the gap the bound proves: (plan − bound) ÷ plan). Null when no run proved a bound.
    /// </summary>
    public static SummaryTable? Bounds(IReadOnlyList<BenchRow> rows)
    {
        var groups = rows.GroupBy(r => (r.Instance, r.Objective)).Where(g => g.Any(r => r.LowerBound is not null)).OrderBy(g => g.Key.Instance, StringComparer.Ordinal).ToList();
        if (groups.Count == 0)
        {
            return null;
        }

        var table = new List<IReadOnlyList<string>>();
        foreach (var g in groups)
        {
            var bound = g.Where(r => r.LowerBound is not null).MaxBy(r => r.LowerBound!.Value)!;
            double b = bound.LowerBound!.Value;
            double? reference = g.Select(r => r.Reference).FirstOrDefault(v => v is not null);
            double? plan = g.Where(r => !r.BoundOnly && r.Feasible).Select(r => (double?)r.ObjectiveValue).Min();
            string ratio = reference is { } v && v > 0 && g.Key.Objective != "vehicles-then-distance" ? Pct(b / v * 100) : "n/a";
            string proved = plan is { } p && Math.Abs(p) > 1e-12 ? Pct(Math.Max(0, (p - b) / Math.Abs(p) * 100)) : "n/a";
            table.Add([g.Key.Instance, g.Key.Objective, N(b), bound.Solver, Seconds(bound.SecondsToBest), reference is { } rv ? N(rv) : "n/a", ratio,
                plan is { } pv ? N(pv) : "n/a", proved]);
        }

        return new SummaryTable(["instance", "objective", "lower bound", "by", "reached at", "reference", "bound ÷ reference", "best plan", "plan within (of optimal)"],
            table, [false, false, true, false, true, true, true, true, true]);
    }

    /// <summary>statistics.csv: one row per solver and budget, plain numbers for other tools.</summary>
    public static void WriteConfigCsv(TextWriter writer, ExperimentStatistics stats)
    {
        using var csv = CsvOutput.Open(writer);
        CsvOutput.Row(csv, "solver", "budget_s", "runs", "feasible", "gap_runs", "median_gap_pct", "q1_gap_pct", "q3_gap_pct", "iqr_gap_pct", "mean_gap_pct",
            "ci95_low_pct", "ci95_high_pct", "best_on", "instances");
        foreach (var c in stats.Configs)
        {
            CsvOutput.Row(csv, c.Solver, N(c.Budget), I(c.Runs), I(c.Feasible), I(c.Gap.Count), N(c.Gap.Median), N(c.Gap.Q1), N(c.Gap.Q3), N(c.Gap.Iqr),
                N(c.Gap.Mean), N(c.Gap.CiLow), N(c.Gap.CiHigh), I(c.BestCount), I(c.Instances));
        }
    }

    /// <summary>comparisons.csv: one row per pair of solvers and budget.</summary>
    public static void WritePairCsv(TextWriter writer, ExperimentStatistics stats)
    {
        using var csv = CsvOutput.Open(writer);
        CsvOutput.Row(csv, "budget_s", "solver_a", "solver_b", "pairs", "zeros", "median_diff_pct", "w_plus", "w_minus", "p_value", "exact", "z", "lower");
        foreach (var p in stats.Pairs)
        {
            string lower = p.Test.Direction < 0 ? p.A : p.Test.Direction > 0 ? p.B : string.Empty;
            CsvOutput.Row(csv, N(p.Budget), p.A, p.B, I(p.Test.Pairs), I(p.Test.Zeros), N(p.Test.MedianDifference), N(p.Test.WPlus), N(p.Test.WMinus),
                N(p.Test.PValue), p.Test.Exact ? "true" : "false", p.Test.Z is { } z ? N(z) : string.Empty, lower);
        }
    }

    public static string Seconds(double s) => s.ToString("0.###", CultureInfo.InvariantCulture) + " s";

    // A value that rounds to zero is shown as 0.00%, not -0.00% (a plan a hair below a reference rounded to two decimals).
    public static string Pct(double x) => !double.IsFinite(x) ? "n/a" : (Math.Abs(x) < 0.005 ? 0 : x).ToString("0.00", CultureInfo.InvariantCulture) + "%";

    private static string N(double x) => double.IsFinite(x) ? x.ToString("0.######", CultureInfo.InvariantCulture) : string.Empty;

    private static string I(int x) => x.ToString(CultureInfo.InvariantCulture);
}
