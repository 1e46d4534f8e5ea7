using Anneal.Reports.Quality;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>
/// A performance profile (Dolan &amp; Moré 2002): for each solver the fraction of runs whose objective is within a
/// factor τ of the best found on the instance. Higher and further left is better; the value at τ = 1 is how often a
/// solver found the best.
/// </summary>
public static class ProfilePlot
{
    public const string FileStem = "profile";
    public static readonly PixelSize Size = new(1000, 560);

    /// <param name="series">One curve per solver and budget, from τ = 1 to <paramref name="tauMax"/>.</param>
    public static Plot Create(IReadOnlyList<StepSeries> series, double tauMax, string subtitle)
    {
        var plot = new Plot();
        plot.Title($"Performance profile ({subtitle})");
        plot.XLabel("τ: objective within this factor of the best found on the instance");
        plot.YLabel("fraction of runs within τ");
        StepLines.Add(plot, series, x => x, Alignment.LowerRight);
        plot.Axes.SetLimitsX(1 - ((tauMax - 1) * 0.02), tauMax);
        return plot;
    }
}
