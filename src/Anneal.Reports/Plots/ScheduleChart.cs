using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Formats.Output;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Anneal.Reports.Plots;

/// <summary>
/// The day of each vehicle used, one row each: its shift as a pale band; driving, waiting and service as bars;
/// above them the windows of its stops (alternating on two thin lanes so neighbours stay apart); lateness and
/// overtime in red.
/// </summary>
public static class ScheduleChart
{
    public const string FileStem = "schedule";
    public const int Width = 1000;

    private const double BarSize = 0.5;
    private const double Tolerance = CostModel.FeasibilityTolerance;

    /// <summary>Picture size for this many rows: taller with more vehicles, within readable bounds.</summary>
    public static PixelSize SizeFor(int rows) => new(Width, Math.Clamp(140 + (34 * rows), 420, 3000));

    public static int Rows(PlanEvaluation evaluation) => evaluation.VehiclesUsed;

    public static Plot Create(Instance instance, PlanEvaluation evaluation)
    {
        var plot = new Plot();
        plot.Title("Schedule per vehicle");
        var bars = new List<Bar>();
        var ticks = new NumericManual();
        double from = double.PositiveInfinity, to = double.NegativeInfinity;
        int row = 0;
        foreach (var route in evaluation.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            var v = instance.Vehicles[route.Vehicle];
            double y = -row;
            ticks.AddMajor(y, v.Id);
            var m = route.Metrics;
            double shiftEnd = double.IsFinite(v.ShiftEnd) ? v.ShiftEnd : m.Return;
            bars.Add(Span(y, v.ShiftStart, shiftEnd, 0.8, Colors.LightGray.WithAlpha(0.45)));
            from = Math.Min(from, Math.Min(v.ShiftStart, m.Departure));
            to = Math.Max(to, Math.Max(shiftEnd, m.Return));
            AddRoute(instance, route, y, bars, Math.Max(1e-9, (m.Return - v.ShiftStart) * 0.003));
            if (m.Overtime > Tolerance && double.IsFinite(v.ShiftEnd))
            {
                bars.Add(Span(y - 0.33, v.ShiftEnd, m.Return, 0.12, Palette.Late));
            }

            row++;
        }

        var plottable = plot.Add.Bars(bars);
        plottable.Horizontal = true;
        plot.Axes.Left.TickGenerator = ticks;
        if (double.IsFinite(from) && double.IsFinite(to))
        {
            plot.Axes.SetLimitsX(from - ((to - from) * 0.02), to + ((to - from) * 0.02));
            plot.Axes.Bottom.TickGenerator = ClockTicks.For(instance, from, to);
        }

        plot.Axes.SetLimitsY(-row + 0.45, 0.6);
        plot.XLabel(instance.Units.Clock ? "time of day" : "time");
        Legend(plot);
        return plot;
    }

    /// <param name="tick">Width of a window's end marks, in time units.</param>
    private static void AddRoute(Instance instance, RouteEvaluation route, double y, List<Bar> bars, double tick)
    {
        double t = route.Metrics.Departure;
        for (int k = 0; k < route.Stops.Length; k++)
        {
            var visit = route.Visits[k];
            var stop = instance.Stops[route.Stops[k]];
            bars.Add(Span(y, t, visit.Arrival, BarSize, Palette.Driving));
            if (visit.Start > visit.Arrival + Tolerance)
            {
                bars.Add(Span(y, visit.Arrival, visit.Start, BarSize, Palette.Waiting));
            }

            bars.Add(Span(y, visit.Start, visit.Departure, BarSize, Palette.Service));
            if (visit.Late > Tolerance)
            {
                // From the window's close to the arrival: how late the truck is (or the time warp a hard window needs).
                bars.Add(Span(y, visit.Arrival - visit.Late, visit.Arrival, BarSize * 0.45, Palette.Late));
            }

            // The window served in, with end marks so that neighbouring windows stay apart; three lanes in turn.
            var w = RoutesCsvWriter.WindowUsed(stop, visit.Arrival);
            if (double.IsFinite(w.Open) && double.IsFinite(w.Close))
            {
                double lane = y + 0.3 + (0.07 * (k % 3));
                bars.Add(Span(lane, w.Open, w.Close, 0.02, Palette.Window.WithAlpha(0.7)));
                bars.Add(Span(lane, w.Open, w.Open + tick, 0.07, Palette.Window));
                bars.Add(Span(lane, w.Close - tick, w.Close, 0.07, Palette.Window));
            }

            t = visit.Departure;
        }

        bars.Add(Span(y, t, route.Metrics.Return, BarSize, Palette.Driving));
    }

    private static Bar Span(double y, double from, double to, double size, Color color) => new()
    {
        Position = y,
        ValueBase = from,
        Value = Math.Max(from, to),
        Size = size,
        FillColor = color,
        LineWidth = 0,
        Orientation = Orientation.Horizontal,
    };

    private static void Legend(Plot plot)
    {
        foreach (var (label, color) in new[]
        {
            ("shift", Colors.LightGray), ("driving", Palette.Driving), ("waiting", Palette.Waiting), ("service", Palette.Service),
            ("time window", Palette.Window), ("late / overtime", Palette.Late),
        })
        {
            plot.Legend.ManualItems.Add(new LegendItem { LabelText = label, FillColor = color });
        }

        plot.Legend.Orientation = Orientation.Horizontal;
        plot.ShowLegend(Edge.Bottom);
    }
}
