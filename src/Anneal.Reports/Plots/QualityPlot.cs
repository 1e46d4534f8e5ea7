using Anneal.Reports.Quality;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>Quality against runtime over a set of benchmark runs: median gap to the reference per solver (log time axis), with its interquartile band.</summary>
public static class QualityPlot
{
    public const string FileStem = "quality";
    public static readonly PixelSize Size = new(1000, 560);

    /// <param name="style">Colour and line pattern (as <see cref="StepLines.Pattern"/>) per curve name, so that a solver keeps its colour across pictures; by default curves are coloured in name order.</param>
    public static Plot Create(IReadOnlyList<BenchRun> runs, Func<string, (int Colour, int Pattern)>? style = null)
    {
        var curves = GapCurves.Compute(runs);
        var plot = new Plot();
        int instances = runs.Select(r => r.Instance).Distinct(StringComparer.Ordinal).Count();
        plot.Title($"Gap to the reference against time ({instances} instances, {runs.Count} runs)");
        plot.XLabel("elapsed seconds (log scale)");
        plot.YLabel("gap to reference, % (median, band = middle half)");
        int k = 0;
        foreach (var (solver, points) in curves.OrderBy(c => c.Key, StringComparer.Ordinal))
        {
            var (colour, pattern) = style?.Invoke(solver) ?? (k, 0);
            k++;
            var color = Palette.Solver(colour);
            if (points.Count == 0)
            {
                continue;
            }

            var xs = new double[points.Count];
            var median = new double[points.Count];
            var lower = new double[points.Count];
            var upper = new double[points.Count];
            for (int i = 0; i < points.Count; i++)
            {
                xs[i] = Math.Log10(points[i].Seconds);
                median[i] = points[i].Median;
                lower[i] = points[i].Lower;
                upper[i] = points[i].Upper;
            }

            var band = plot.Add.FillY(xs, lower, upper);
            band.FillColor = color.WithAlpha(0.2);
            band.LineWidth = 0;
            var line = plot.Add.ScatterLine(xs, median, color);
            line.LineWidth = 2.5f;
            line.LinePattern = StepLines.Pattern(pattern);
            line.LegendText = solver;
        }

        plot.Add.HorizontalLine(0, 1, Colors.Gray, LinePattern.Dashed);
        plot.Axes.Bottom.TickGenerator = LogSecondsTicks.Create();
        // Gaps fall with time, so the upper right is where the curves are not.
        plot.ShowLegend(Alignment.UpperRight);
        return plot;
    }
}
