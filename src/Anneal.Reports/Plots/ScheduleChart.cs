using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Anneal.Reports.Plots;

/// <summary>
/// The day of each vehicle used, one band each, tinted in the vehicle's route colour from the map: its shift as the
/// band, and on its top row driving, waiting and service as bars. Under that row every stop has a row of its own, in
/// visiting order and labelled with its stop id: the stop's windows as a thin line with end marks, and on the same
/// line the waiting and service of the visit, level with the bars above, so each window sits beside its own visit.
/// Lateness and overtime are red; a driver's break (under driving rules) is lavender on the vehicle's row.
/// </summary>
public static class ScheduleChart
{
    public const string FileStem = "schedule";
    public const int Width = 1000;

    private const double BarSize = 0.5;
    private const double VehicleRow = 1.0;
    private const double StopRow = 0.42;
    private const double PixelsPerUnit = 38;
    private const int LabelledStops = 300;
    private const double Tolerance = CostModel.FeasibilityTolerance;

    /// <summary>Picture size for a plan: taller with more vehicles and stops, within readable bounds.</summary>
    public static PixelSize SizeFor(PlanEvaluation evaluation) =>
        new(Width, Math.Clamp(150 + (int)(PixelsPerUnit * Height(evaluation)), 420, 4000));

    /// <summary>Height of all bands in plot units.</summary>
    private static double Height(PlanEvaluation evaluation)
    {
        double height = 0;
        foreach (var route in evaluation.Routes)
        {
            if (route.Stops.Length > 0)
            {
                height += VehicleRow + (StopRow * route.Stops.Length);
            }
        }

        return height;
    }

    public static Plot Create(Instance instance, PlanEvaluation evaluation)
    {
        var plot = new Plot();
        plot.Title("Schedule per vehicle, each stop on its own row under its vehicle");
        var bars = new List<Bar>();
        var ticks = new NumericManual();
        bool labelStops = instance.StopCount <= LabelledStops;
        double from = double.PositiveInfinity, to = double.NegativeInfinity;
        double top = 0;
        int used = 0;
        bool breaks = false;
        foreach (var route in evaluation.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            var v = instance.Vehicles[route.Vehicle];
            var m = route.Metrics;
            double height = VehicleRow + (StopRow * route.Stops.Length);
            double y = top - (VehicleRow / 2);
            ticks.AddMajor(y, v.Id);
            double shiftEnd = double.IsFinite(v.ShiftEnd) ? v.ShiftEnd : m.Return;
            bars.Add(Span(top - (height / 2), v.ShiftStart, shiftEnd, height - 0.12, Palette.Route(used).WithAlpha(0.16)));
            from = Math.Min(from, Math.Min(v.ShiftStart, m.Departure));
            to = Math.Max(to, Math.Max(shiftEnd, m.Return));
            AddRoute(instance, route, y, bars, ticks, labelStops, Math.Max(1e-9, (m.Return - v.ShiftStart) * 0.003));
            foreach (var b in route.Breaks)
            {
                bars.Add(Span(y, b.Start, b.End, BarSize, Palette.Break));
                breaks = true;
            }
            if (m.Overtime > Tolerance && double.IsFinite(v.ShiftEnd))
            {
                bars.Add(Span(y - 0.33, v.ShiftEnd, m.Return, 0.12, Palette.Late));
            }

            top -= height;
            used++;
        }

        var plottable = plot.Add.Bars(bars);
        plottable.Horizontal = true;
        plot.Axes.Left.TickGenerator = ticks;
        plot.Axes.Left.TickLabelStyle.FontSize = 11;
        if (double.IsFinite(from) && double.IsFinite(to))
        {
            plot.Axes.SetLimitsX(from - ((to - from) * 0.02), to + ((to - from) * 0.02));
            plot.Axes.Bottom.TickGenerator = ClockTicks.For(instance, from, to);
        }

        plot.Axes.SetLimitsY(top - 0.05, 0.05);
        plot.XLabel(instance.Units.Clock ? "time of day" : "time");
        Legend(plot, breaks);
        return plot;
    }

    /// <param name="y">Centre of the vehicle's bar row; the stops' rows follow below it.</param>
    /// <param name="tick">Width of a window's end marks, in time units.</param>
    private static void AddRoute(Instance instance, RouteEvaluation route, double y, List<Bar> bars, NumericManual ticks, bool label, double tick)
    {
        double t = route.Metrics.Departure;
        for (int k = 0; k < route.Stops.Length; k++)
        {
            var visit = route.Visits[k];
            var stop = instance.Stops[route.Stops[k]];
            bars.Add(Span(y, t, visit.Arrival, BarSize, Palette.Driving));
            Visit(bars, y, visit, BarSize);

            double lane = y - (VehicleRow / 2) - (StopRow * (k + 0.5));
            if (label)
            {
                ticks.AddMajor(lane, $"{k + 1}  {stop.Id}");
            }

            foreach (var w in stop.Windows)
            {
                if (double.IsFinite(w.Open) && double.IsFinite(w.Close))
                {
                    bars.Add(Span(lane, w.Open, w.Close, 0.05, Palette.Window));
                    bars.Add(Span(lane, w.Open, w.Open + tick, 0.24, Palette.Window));
                    bars.Add(Span(lane, w.Close - tick, w.Close, 0.24, Palette.Window));
                }
            }

            Visit(bars, lane, visit, 0.2);
            t = visit.Departure;
        }

        bars.Add(Span(y, t, route.Metrics.Return, BarSize, Palette.Driving));
    }

    /// <summary>Waiting, service and lateness of one visit at this height.</summary>
    private static void Visit(List<Bar> bars, double y, VisitTimes visit, double size)
    {
        if (visit.Start > visit.Arrival + Tolerance)
        {
            bars.Add(Span(y, visit.Arrival, visit.Start, size, Palette.Waiting));
        }

        bars.Add(Span(y, visit.Start, visit.Departure, size, Palette.Service));
        if (visit.Late > Tolerance)
        {
            // From the window's close to the arrival: how late the truck is (or the time warp a hard window needs).
            bars.Add(Span(y, visit.Arrival - visit.Late, visit.Arrival, size * 0.45, Palette.Late));
        }
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

    private static void Legend(Plot plot, bool breaks)
    {
        var items = new List<(string, Color)>
        {
            ("shift (tinted as on the map)", Colors.LightGray), ("driving", Palette.Driving), ("waiting", Palette.Waiting), ("service", Palette.Service),
            ("time window", Palette.Window), ("late / overtime", Palette.Late),
        };
        if (breaks)
        {
            items.Add(("driver's break", Palette.Break));
        }

        foreach (var (label, color) in items)
        {
            plot.Legend.ManualItems.Add(new LegendItem { LabelText = label, FillColor = color });
        }

        plot.Legend.Orientation = Orientation.Horizontal;
        plot.ShowLegend(Edge.Bottom);
    }
}
