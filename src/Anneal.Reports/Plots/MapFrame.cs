using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Travel;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Anneal.Reports.Plots;

/// <summary>
/// How a map places coordinates on the page so that a kilometre is as long across as it is up. Degrees use an
/// equirectangular projection at the mean latitude of the job (x = longitude · cos φ̄, y = latitude): one unit on
/// either axis is then one degree of latitude, and both axes keep ticks in degrees. Planar x/y are drawn as given.
/// </summary>
public sealed class MapFrame
{
    private const double KmPerDegree = GreatCircle.EarthRadiusKm * Math.PI / 180;

    private readonly bool degrees;
    private readonly double xScale;
    private readonly double kmPerUnit;
    private readonly string unit;

    private MapFrame(bool degrees, double xScale, double kmPerUnit, string unit)
    {
        this.degrees = degrees;
        this.xScale = xScale;
        this.kmPerUnit = kmPerUnit;
        this.unit = unit;
    }

    public static MapFrame For(Instance instance)
    {
        if (!instance.LatLon)
        {
            string unit = instance.Units.Distance;
            return new MapFrame(false, 1, 1, unit);
        }

        double sum = 0;
        int count = 0;
        foreach (var s in instance.Stops)
        {
            sum += s.Y;
            count++;
        }

        foreach (var d in instance.Depots)
        {
            sum += d.Y;
            count++;
        }

        double meanLatitude = count == 0 ? 0 : sum / count;
        return new MapFrame(true, Math.Cos(meanLatitude * Math.PI / 180), KmPerDegree, "km");
    }

    public double X(double x) => x * xScale;

    public double Y(double y) => y;

    /// <summary>Axis labels, degree ticks for lat/lon, and a scale bar under the drawing; bounds are in page units.</summary>
    public void Decorate(Plot plot, double minX, double maxX, double minY, double maxY)
    {
        double span = Math.Max(Math.Max(maxX - minX, maxY - minY), 1e-9);
        if (degrees)
        {
            plot.XLabel("longitude (drawn to scale at the mean latitude)");
            plot.YLabel("latitude");
            plot.Axes.Bottom.TickGenerator = DegreeTicks(minX / xScale, maxX / xScale, span / xScale, xScale, 'E', 'W');
            plot.Axes.Left.TickGenerator = DegreeTicks(minY, maxY, span, 1, 'N', 'S');
        }
        else
        {
            string suffix = unit.Length > 0 ? $" ({unit})" : string.Empty;
            plot.XLabel("x" + suffix);
            plot.YLabel("y" + suffix);
        }

        ScaleBar(plot, minX, minY - (span * 0.06), span);
    }

    private void ScaleBar(Plot plot, double x, double y, double span)
    {
        double length = Nice(span * kmPerUnit / 5);
        double width = length / kmPerUnit;
        double tick = span * 0.012;
        foreach (var (x1, y1, x2, y2) in new[] { (x, y, x + width, y), (x, y - tick, x, y + tick), (x + width, y - tick, x + width, y + tick) })
        {
            var line = plot.Add.Line(x1, y1, x2, y2);
            line.LineWidth = 2.5f;
            line.LineColor = Palette.Depot;
        }

        string label = unit.Length > 0 ? $"{Number(length)} {unit}" : $"{Number(length)} distance units";
        var text = plot.Add.Text(label, x + (width / 2), y + tick);
        text.LabelFontSize = 13;
        text.LabelFontColor = Palette.Depot;
        text.LabelAlignment = Alignment.LowerCenter;
    }

    /// <summary>Ticks every nice step of degrees over a wide range (the axis may widen to keep the scale square).</summary>
    private static NumericManual DegreeTicks(double min, double max, double span, double scale, char positive, char negative)
    {
        double step = Nice(span / 6);
        int decimals = Math.Max(0, (int)-Math.Floor(Math.Log10(step) + 1e-9));
        string format = "0." + new string('0', Math.Max(decimals, 1));
        var ticks = new NumericManual();
        long first = (long)Math.Floor((min - (3 * span)) / step);
        long last = (long)Math.Ceiling((max + (3 * span)) / step);
        for (long k = first; k <= last; k++)
        {
            double value = k * step;
            string hemisphere = Math.Abs(value) < step / 2 ? string.Empty : (value > 0 ? positive : negative).ToString();
            ticks.AddMajor(value * scale, Math.Abs(value).ToString(decimals == 0 ? "0" : format, CultureInfo.InvariantCulture) + "°" + hemisphere);
        }

        return ticks;
    }

    /// <summary>The largest 1, 2 or 5 times a power of ten not above the value.</summary>
    private static double Nice(double value)
    {
        double power = Math.Pow(10, Math.Floor(Math.Log10(value)));
        double leading = value / power;
        return (leading >= 5 ? 5 : leading >= 2 ? 2 : 1) * power;
    }

    private static string Number(double value) => value.ToString(value >= 1 ? "#,0" : "0.###", CultureInfo.InvariantCulture);
}
