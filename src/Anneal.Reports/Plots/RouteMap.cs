using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>
/// The plan on a map drawn to scale (see <see cref="MapFrame"/>), with axis units and a scale bar: each route in its
/// colour from <see cref="Palette.Route"/>, drawn from the depot through its stops in visiting order and back; the
/// depots as black squares, late stops ringed in red, unserved stops as crosses. Past a few hundred stops lines and
/// markers thin out and the per-vehicle legend is left off, so a 1,000-stop plan stays readable.
/// </summary>
public static class RouteMap
{
    public const string FileStem = "routes";
    public static readonly PixelSize Size = new(1000, 800);

    private const int BusyStops = 300;
    private const int LegendRoutes = 20;

    public static Plot Create(Instance instance, PlanEvaluation evaluation)
    {
        var plot = new Plot();
        var frame = MapFrame.For(instance);
        plot.Title($"Routes ({evaluation.VehiclesUsed} vehicles, {instance.StopCount} stops)");
        bool busy = instance.StopCount > BusyStops;
        int used = 0;
        foreach (var route in evaluation.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            var v = instance.Vehicles[route.Vehicle];
            var start = instance.Depots[v.StartDepot];
            var end = instance.Depots[v.EndDepot];
            var xs = new double[route.Stops.Length + 2];
            var ys = new double[route.Stops.Length + 2];
            xs[0] = frame.X(start.X);
            ys[0] = frame.Y(start.Y);
            for (int k = 0; k < route.Stops.Length; k++)
            {
                var stop = instance.Stops[route.Stops[k]];
                xs[k + 1] = frame.X(stop.X);
                ys[k + 1] = frame.Y(stop.Y);
            }

            xs[^1] = frame.X(end.X);
            ys[^1] = frame.Y(end.Y);
            var line = plot.Add.Scatter(xs, ys, Palette.Route(used));
            line.LineWidth = busy ? 0.8f : 1.8f;
            line.LinePattern = Palette.RoutePattern(used);
            line.MarkerSize = busy ? 3 : 7;
            if (evaluation.VehiclesUsed <= LegendRoutes)
            {
                line.LegendText = v.Id;
            }

            used++;
        }

        AddLate(plot, instance, evaluation, frame, busy);
        AddUnserved(plot, instance, evaluation, frame, busy);
        var dx = new double[instance.Depots.Count];
        var dy = new double[instance.Depots.Count];
        for (int d = 0; d < dx.Length; d++)
        {
            dx[d] = frame.X(instance.Depots[d].X);
            dy[d] = frame.Y(instance.Depots[d].Y);
        }

        var depots = plot.Add.Markers(dx, dy, MarkerShape.FilledSquare, busy ? 12 : 14, Palette.Depot);
        depots.LegendText = "depot";
        Frame(plot, instance, frame);
        plot.Axes.SquareUnits();
        plot.Legend.Alignment = Alignment.UpperRight;
        plot.ShowLegend(Edge.Right);
        return plot;
    }

    private static void AddLate(Plot plot, Instance instance, PlanEvaluation evaluation, MapFrame frame, bool busy)
    {
        var xs = new List<double>();
        var ys = new List<double>();
        foreach (var route in evaluation.Routes)
        {
            for (int k = 0; k < route.Stops.Length; k++)
            {
                if (route.Visits[k].Late > CostModel.FeasibilityTolerance)
                {
                    xs.Add(frame.X(instance.Stops[route.Stops[k]].X));
                    ys.Add(frame.Y(instance.Stops[route.Stops[k]].Y));
                }
            }
        }

        if (xs.Count > 0)
        {
            var late = plot.Add.Markers(xs.ToArray(), ys.ToArray(), MarkerShape.OpenCircle, busy ? 9 : 16, Palette.Late);
            late.MarkerLineWidth = busy ? 1.5f : 2.5f;
            late.LegendText = $"late ({xs.Count})";
        }
    }

    private static void AddUnserved(Plot plot, Instance instance, PlanEvaluation evaluation, MapFrame frame, bool busy)
    {
        if (evaluation.Unserved.Count == 0)
        {
            return;
        }

        var xs = new double[evaluation.Unserved.Count];
        var ys = new double[evaluation.Unserved.Count];
        for (int k = 0; k < xs.Length; k++)
        {
            xs[k] = frame.X(instance.Stops[evaluation.Unserved[k]].X);
            ys[k] = frame.Y(instance.Stops[evaluation.Unserved[k]].Y);
        }

        var marks = plot.Add.Markers(xs, ys, MarkerShape.Eks, busy ? 8 : 13, Palette.Unserved);
        marks.MarkerLineWidth = 2;
        marks.LegendText = $"unserved ({xs.Length})";
    }

    /// <summary>Labels, ticks and the scale bar, laid out around every stop and depot (drawn or not).</summary>
    private static void Frame(Plot plot, Instance instance, MapFrame frame)
    {
        double minX = double.PositiveInfinity, maxX = double.NegativeInfinity, minY = double.PositiveInfinity, maxY = double.NegativeInfinity;
        foreach (var (x, y) in Points(instance))
        {
            minX = Math.Min(minX, frame.X(x));
            maxX = Math.Max(maxX, frame.X(x));
            minY = Math.Min(minY, frame.Y(y));
            maxY = Math.Max(maxY, frame.Y(y));
        }

        if (double.IsFinite(minX))
        {
            frame.Decorate(plot, minX, maxX, minY, maxY);
        }
    }

    private static IEnumerable<(double X, double Y)> Points(Instance instance)
    {
        foreach (var s in instance.Stops)
        {
            yield return (s.X, s.Y);
        }

        foreach (var d in instance.Depots)
        {
            yield return (d.X, d.Y);
        }
    }
}
