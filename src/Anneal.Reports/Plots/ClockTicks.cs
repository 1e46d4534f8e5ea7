using Anneal.Core.Model;
using Anneal.Formats.Output;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Anneal.Reports.Plots;

/// <summary>Time-of-day ticks: whole hours as HH:MM for minute-based jobs, automatic numbers otherwise.</summary>
public static class ClockTicks
{
    public static ITickGenerator For(Instance instance, double from, double to)
    {
        if (!instance.Units.Clock || !(to > from))
        {
            return new NumericAutomatic();
        }

        double span = to - from;
        int step = span <= 8 * 60 ? 60 : span <= 16 * 60 ? 120 : 240;
        var ticks = new NumericManual();
        double first = Math.Ceiling(from / step) * step;
        for (double t = first; t <= to + 1e-9; t += step)
        {
            ticks.AddMajor(t, instance.Units.Format(t));
        }

        return ticks;
    }
}
