using System.Text;
using Anneal.Formats.Output;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>Saves a plot as PNG and SVG, each written whole to a temporary file beside the target and renamed over it.</summary>
public static partial class PlotFile
{
    /// <summary>Writes &lt;stem&gt;.png and &lt;stem&gt;.svg in <paramref name="folder"/>; returns the PNG bytes (for embedding).</summary>
    public static byte[] Save(Plot plot, string folder, string stem, PixelSize size)
    {
        byte[] png = Png(plot, size);
        AtomicFile.Write(Path.Combine(folder, stem + ".png"), s => s.Write(png));
        string svg = StableIds(SvgWithSolidLines(plot, size));
        AtomicFile.Write(Path.Combine(folder, stem + ".svg"), s => s.Write(Encoding.UTF8.GetBytes(svg)));
        return png;
    }

    /// <summary>
    /// Skia numbers SVG clip paths from a counter shared by the whole process, so the same plot drawn twice would
    /// differ; renumbering them by first appearance makes a redraw byte-identical.
    /// </summary>
    public static string StableIds(string svg)
    {
        var ids = new Dictionary<string, string>(StringComparer.Ordinal);
        return ClipId().Replace(svg, m =>
        {
            if (!ids.TryGetValue(m.Value, out var id))
            {
                ids[m.Value] = id = "clip" + ids.Count.ToString(System.Globalization.CultureInfo.InvariantCulture);
            }

            return id;
        });
    }

    /// <summary>
    /// Skia's SVG canvas cannot write the dash effect of a patterned line: it draws the line solid anyway and prints
    /// "Unsupported path effect in addPaint." to standard error for every segment (dozens of lines for a job with more
    /// routes than hues). So the SVG is drawn with solid lines, as it would show them, and the patterns are put back.
    /// </summary>
    private static string SvgWithSolidLines(Plot plot, PixelSize size)
    {
        var patterned = new List<(IHasLine Line, LinePattern Pattern)>();
        foreach (var plottable in plot.GetPlottables())
        {
            if (plottable is IHasLine line && !line.LinePattern.Equals(LinePattern.Solid))
            {
                patterned.Add((line, line.LinePattern));
                line.LinePattern = LinePattern.Solid;
            }
        }

        try
        {
            return plot.GetSvgXml((int)size.Width, (int)size.Height);
        }
        finally
        {
            foreach (var (line, pattern) in patterned)
            {
                line.LinePattern = pattern;
            }
        }
    }

    public static byte[] Png(Plot plot, PixelSize size) => plot.GetImageBytes((int)size.Width, (int)size.Height, ImageFormat.Png);

    [System.Text.RegularExpressions.GeneratedRegex(@"\bcl_[0-9a-f]+\b")]
    private static partial System.Text.RegularExpressions.Regex ClipId();
}
