using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Travel;
using Anneal.Formats.Output;
using Anneal.Reports.Plots;
using Color = ScottPlot.Color;
using Palette = Anneal.Reports.Plots.Palette;

namespace Anneal.Tests.Reports;

/// <summary>Pictures that do not mislead: maps to scale, route colours apart from the lateness red, each window on its stop's row.</summary>
public sealed class PictureTests
{
    [Fact]
    public void Route_colours_keep_clear_of_the_lateness_red_and_of_each_other()
    {
        // Colour differences as CIE 1976 ΔE*ab in L*a*b* (CIE 15:2004), from sRGB (IEC 61966-2-1) under D65.
        // A ΔE of about 2.3 is just noticeable (Sharma, Digital Color Imaging Handbook, 2003; figure from memory); the thresholds here
        // ask for far more: routes at least 20 apart, every route at least 40 from the red that marks lateness.
        Assert.Equal(12, RouteColours.Hex.Count);
        var late = Lab(Palette.Late);
        for (int i = 0; i < RouteColours.Hex.Count; i++)
        {
            Assert.Equal(Color.FromHex(RouteColours.Hex[i]), Palette.Route(i)); // the pictures use the shared list
            Assert.True(Distance(Lab(Palette.Route(i)), late) >= 40, $"{RouteColours.Hex[i]} is too close to the lateness red");
            for (int j = i + 1; j < RouteColours.Hex.Count; j++)
            {
                double d = Distance(Lab(Palette.Route(i)), Lab(Palette.Route(j)));
                Assert.True(d >= 20, $"{RouteColours.Hex[i]} and {RouteColours.Hex[j]} are only {d:0.0} apart");
            }
        }

        Assert.Equal(Palette.Route(0), Palette.Route(12));
        Assert.NotEqual(Palette.RoutePattern(0), Palette.RoutePattern(12)); // route 13 is dashed, not taken for route 1
    }

    [Fact]
    public void A_lat_lon_map_draws_a_kilometre_as_long_across_as_up()
    {
        // At 60° N a degree of longitude is half a degree of latitude on the ground (cos 60° = 1/2); drawn as plain
        // degrees, an east-west leg would look twice its length. Ground distances by the haversine formula.
        var instance = LatLonInstance((60.0, 10.0), (60.0, 10.2), (60.1, 10.0));
        var frame = MapFrame.For(instance);
        var a = instance.Stops[0];
        var east = instance.Stops[1];
        var north = instance.Stops[2];
        double eastKm = GreatCircle.Kilometres(a.Y, a.X, east.Y, east.X);
        double northKm = GreatCircle.Kilometres(a.Y, a.X, north.Y, north.X);
        double eastPage = Math.Abs(frame.X(east.X) - frame.X(a.X));
        double northPage = Math.Abs(frame.Y(north.Y) - frame.Y(a.Y));
        Assert.Equal(eastKm / northKm, eastPage / northPage, 0.01);

        var plan = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [0, 1, 2])]));
        using var map = RouteMap.Create(instance, plan);
        Assert.Contains("longitude", map.Axes.Bottom.Label.Text, StringComparison.Ordinal);
        Assert.Equal("latitude", map.Axes.Left.Label.Text);
        Assert.Contains(map.GetPlottables().OfType<ScottPlot.Plottables.Text>(), t => t.LabelText.EndsWith(" km", StringComparison.Ordinal)); // the scale bar
        PngCheck.Valid(PlotFile.Png(map, RouteMap.Size), 1000, 800);
    }

    [Fact]
    public void A_planar_map_says_km()
    {
        var (instance, plan) = ReportFixtures.DemoPlan();
        using var map = RouteMap.Create(instance, plan);
        Assert.Equal("x (km)", map.Axes.Bottom.Label.Text);
        Assert.Equal("y (km)", map.Axes.Left.Label.Text);
    }

    [Fact]
    public void Each_stop_has_its_own_schedule_row_with_its_windows_beside_its_service()
    {
        var (instance, plan) = ReportFixtures.MerrowdalePlan();
        using var chart = ScheduleChart.Create(instance, plan);
        var bars = chart.GetPlottables().OfType<ScottPlot.Plottables.BarPlot>().Single().Bars;
        var rows = new HashSet<double>();
        foreach (var route in plan.Routes)
        {
            for (int k = 0; k < route.Stops.Length; k++)
            {
                var visit = route.Visits[k];
                var stop = instance.Stops[route.Stops[k]];
                Assert.NotEmpty(stop.Windows);

                // The service bar on the vehicle's row and its twin on the stop's row: the twin is the one that shares
                // a row with this stop's windows, and no other stop uses that row.
                var services = bars.Where(b => b.FillColor == Palette.Service && b.ValueBase == visit.Start && b.Value == visit.Departure).ToList();
                var row = services.Select(b => b.Position)
                    .Where(y => stop.Windows.All(w => bars.Any(b => b.Position == y && b.FillColor == Palette.Window && b.ValueBase == w.Open && b.Value == w.Close)))
                    .ToList();
                Assert.Single(row);
                Assert.True(rows.Add(row[0]), $"stop {stop.Id} shares its row");
                if (visit.Start > visit.Arrival + 1e-6)
                {
                    Assert.Contains(bars, b => b.Position == row[0] && b.FillColor == Palette.Waiting && b.ValueBase == visit.Arrival && b.Value == visit.Start);
                }
            }
        }

        Assert.Equal(instance.StopCount, rows.Count);
    }

    private static Instance LatLonInstance(params (double Lat, double Lon)[] points)
    {
        var stops = points.Select((p, i) => new Stop { Id = "s" + i, X = p.Lon, Y = p.Lat, Demand = [1], Windows = [TimeWindow.Always] }).ToList();
        var x = points.Select(p => p.Lon).Append(points[0].Lon).ToArray();
        var y = points.Select(p => p.Lat).Append(points[0].Lat).ToArray();
        var vehicles = new List<Vehicle> { new() { Id = "van", Capacity = [10] } };
        return new Instance("latlon", stops, [new Depot { Id = "d", X = points[0].Lon, Y = points[0].Lat }], vehicles, ["kg"], [], new RuleSet(), Objective.Cost,
            TravelTable.Planar(x, y, roundToInteger: false, timePerDistance: 1), Units.Minutes) { LatLon = true };
    }

    private static (double L, double A, double B) Lab(Color c)
    {
        static double Linear(byte v)
        {
            double s = v / 255.0;
            return s <= 0.04045 ? s / 12.92 : Math.Pow((s + 0.055) / 1.055, 2.4);
        }

        double r = Linear(c.R), g = Linear(c.G), b = Linear(c.B);
        double x = ((0.4124 * r) + (0.3576 * g) + (0.1805 * b)) / 0.95047;
        double y = (0.2126 * r) + (0.7152 * g) + (0.0722 * b);
        double z = ((0.0193 * r) + (0.1192 * g) + (0.9505 * b)) / 1.08883;
        static double F(double t) => t > Math.Pow(6.0 / 29, 3) ? Math.Cbrt(t) : (t / (3 * (6.0 / 29) * (6.0 / 29))) + (4.0 / 29);
        return ((116 * F(y)) - 16, 500 * (F(x) - F(y)), 200 * (F(y) - F(z)));
    }

    private static double Distance((double L, double A, double B) p, (double L, double A, double B) q) =>
        Math.Sqrt(((p.L - q.L) * (p.L - q.L)) + ((p.A - q.A) * (p.A - q.A)) + ((p.B - q.B) * (p.B - q.B)));
}
