using System.Globalization;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Anneal.Reports.Plots;

/// <summary>A log time axis: data are drawn at log10(seconds), ticks at whole decades labelled in seconds.</summary>
public static class LogSecondsTicks
{
    public static ITickGenerator Create() => new NumericAutomatic
    {
        MinorTickGenerator = new LogMinorTickGenerator(),
        IntegerTicksOnly = true,
        LabelFormatter = x => Label(Math.Pow(10, x)),
    };

    private static string Label(double s) => s >= 1
        ? s.ToString("0", CultureInfo.InvariantCulture) + " s"
        : s.ToString("0.###", CultureInfo.InvariantCulture) + " s";
}
