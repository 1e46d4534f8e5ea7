using System.Text;
using Anneal.Formats.Output;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>Saves a plot as PNG and SVG, each written whole to a temporary file beside the target and renamed over it.</summary>
public static class PlotFile
{
    /// <summary>Writes &lt;stem&gt;.png and &lt;stem&gt;.svg in <paramref name="folder"/>; returns the PNG bytes (for embedding).</summary>
    public static byte[] Save(Plot plot, string folder, string stem, PixelSize size)
    {
        byte[] png = Png(plot, size);
        AtomicFile.Write(Path.Combine(folder, stem + ".png"), s => s.Write(png));
        string svg = plot.GetSvgXml((int)size.Width, (int)size.Height);
        AtomicFile.Write(Path.Combine(folder, stem + ".svg"), s => s.Write(Encoding.UTF8.GetBytes(svg)));
        return png;
    }

    public static byte[] Png(Plot plot, PixelSize size) => plot.GetImageBytes((int)size.Width, (int)size.Height, ImageFormat.Png);
}
