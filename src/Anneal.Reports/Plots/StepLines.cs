using Anneal.Reports.Quality;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>Draws step curves with the shared solver colours; used by the profile and time-to-target pictures.</summary>
public static class StepLines
{
    private static readonly LinePattern[] Patterns = [LinePattern.Solid, LinePattern.Dashed, LinePattern.Dotted, LinePattern.DenselyDashed];

    /// <summary>0 solid, 1 dashed, 2 dotted, 3 densely dashed, then again.</summary>
    public static LinePattern Pattern(int k) => Patterns[k % Patterns.Length];

    public static void Add(Plot plot, IReadOnlyList<StepSeries> series, Func<double, double> x, Alignment legend)
    {
        foreach (var s in series)
        {
            if (s.X.Count == 0)
            {
                continue;
            }

            var xs = new double[s.X.Count];
            for (int i = 0; i < xs.Length; i++)
            {
                xs[i] = x(s.X[i]);
            }

            var line = plot.Add.ScatterLine(xs, s.Y.ToArray(), Palette.Solver(s.Colour));
            line.ConnectStyle = ConnectStyle.StepHorizontal;
            line.LinePattern = Pattern(s.Pattern);
            line.LineWidth = 2.5f;
            line.LegendText = s.Label;
        }

        plot.Axes.SetLimitsY(-0.02, 1.02);
        plot.ShowLegend(legend);
    }
}
