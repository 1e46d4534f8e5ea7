using Anneal.Reports.Quality;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>
/// Time to target: for each solver and target (within x% of the reference), the fraction of runs that had reached it
/// by each moment (log time axis). A curve that ends below 1 is the share of runs that reached the target at all.
/// </summary>
public static class TimeToTargetPlot
{
    public const string FileStem = "time-to-target";
    public static readonly PixelSize Size = new(1000, 560);

    // Times at or below zero cannot sit on a log axis.
    private const double EarliestSeconds = 0.001;

    public static Plot Create(IReadOnlyList<StepSeries> series, string subtitle)
    {
        var plot = new Plot();
        plot.Title($"Time to target ({subtitle})");
        plot.XLabel("elapsed seconds (log scale)");
        plot.YLabel("fraction of runs within target");
        // The curves rise to the right, so the upper left is where they are not.
        StepLines.Add(plot, series, s => Math.Log10(Math.Max(EarliestSeconds, s)), Alignment.UpperLeft);
        plot.Axes.Bottom.TickGenerator = LogSecondsTicks.Create();
        return plot;
    }
}
