using System.Globalization;
using Anneal.Experiments.Analysis;
using Anneal.Reports.Plots;
using Anneal.Reports.Quality;

namespace Anneal.Experiments.Summary;

/// <summary>The three pictures of an experiment, written as PNG and SVG into the output folder; the PNG bytes are kept for the HTML summary.</summary>
public sealed record ExperimentPictures(byte[]? Profile, byte[]? Quality, byte[]? TimeToTarget)
{
    public static ExperimentPictures Draw(string outDir, IReadOnlyList<BenchRow> rows, IReadOnlyList<TracedRun> traced, IReadOnlyList<double> percents)
    {
        var solvers = rows.Select(r => r.Solver).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
        var budgets = rows.Select(r => r.BudgetSeconds).Distinct().OrderDescending().ToList();
        int instances = rows.Select(r => r.Instance).Distinct(StringComparer.Ordinal).Count();
        int seeds = rows.Select(r => r.Seed).Distinct().Count();
        string subtitle = string.Create(CultureInfo.InvariantCulture, $"{instances} instances × {seeds} seed(s)");

        byte[]? profile = null;
        var profiles = PerformanceProfile.Compute(rows);
        if (profiles.Count > 0)
        {
            double worst = profiles.SelectMany(p => p.Ratios).Where(double.IsFinite).DefaultIfEmpty(1).Max();
            double tauMax = Math.Max(1.01, 1 + ((worst - 1) * 1.1));
            var series = profiles.Select(p => ProfileCurve(p, tauMax, solvers.IndexOf(p.Solver), budgets.IndexOf(p.Budget))).ToList();
            profile = PlotFile.Save(ProfilePlot.Create(series, tauMax, subtitle), outDir, ProfilePlot.FileStem, ProfilePlot.Size);
        }

        byte[]? quality = null;
        if (traced.Count > 0)
        {
            var runs = traced.Select(t => new BenchRun(t.Row.Instance, Label(t.Row.Solver, t.Row.BudgetSeconds), t.Row.Seed, t.Trace, t.Reference)).ToList();
            var styles = traced.Select(t => (Label(t.Row.Solver, t.Row.BudgetSeconds), solvers.IndexOf(t.Row.Solver), budgets.IndexOf(t.Row.BudgetSeconds)))
                .Distinct().ToDictionary(s => s.Item1, s => (s.Item2, s.Item3), StringComparer.Ordinal);
            quality = PlotFile.Save(QualityPlot.Create(runs, label => styles[label]), outDir, QualityPlot.FileStem, QualityPlot.Size);
        }

        byte[]? toTarget = null;
        var targets = Analysis.TimeToTarget.Compute(traced, percents);
        if (targets.Count > 0)
        {
            var series = targets.Select(t => TargetCurve(t, solvers.IndexOf(t.Solver), percents.ToList().IndexOf(t.Percent))).ToList();
            toTarget = PlotFile.Save(TimeToTargetPlot.Create(series, subtitle + ", each solver at its longest budget"), outDir, TimeToTargetPlot.FileStem, TimeToTargetPlot.Size);
        }

        return new ExperimentPictures(profile, quality, toTarget);
    }

    public static string Label(string solver, double budget) => string.Create(CultureInfo.InvariantCulture, $"{solver} · {budget:0.###} s");

    private static StepSeries ProfileCurve(ProfileSeries p, double tauMax, int colour, int pattern)
    {
        var xs = new List<double> { 1 };
        var ys = new List<double> { p.Rho(1) };
        foreach (double r in p.Ratios)
        {
            if (double.IsFinite(r) && r > xs[^1])
            {
                xs.Add(r);
                ys.Add(p.Rho(r));
            }
        }

        xs.Add(tauMax);
        ys.Add(ys[^1]);
        return new StepSeries(Label(p.Solver, p.Budget), colour, pattern, xs, ys);
    }

    private static StepSeries TargetCurve(TargetSeries t, int colour, int pattern)
    {
        var xs = new List<double> { 0.001 };
        var ys = new List<double> { 0 };
        foreach (double s in t.Seconds)
        {
            xs.Add(Math.Max(0.001, s));
            ys.Add(t.FractionBy(s));
        }

        xs.Add(Math.Max(t.Budget, xs[^1]));
        ys.Add(ys[^1]);
        return new StepSeries(string.Create(CultureInfo.InvariantCulture, $"{t.Solver} within {t.Percent:0.##}%"), colour, pattern, xs, ys);
    }
}
