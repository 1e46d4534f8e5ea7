using SkiaSharp;

namespace Anneal.Tests.Fixtures;

/// <summary>Decodes a PNG and checks its size and that it is not blank (its pixels vary).</summary>
internal static class PngCheck
{
    public static void Valid(byte[] png, int width, int height)
    {
        Assert.True(png.Length > 8 && png[0] == 0x89 && png[1] == (byte)'P' && png[2] == (byte)'N' && png[3] == (byte)'G', "PNG signature");
        using var bitmap = SKBitmap.Decode(png);
        Assert.NotNull(bitmap);
        Assert.Equal(width, bitmap.Width);
        Assert.Equal(height, bitmap.Height);
        Assert.True(LuminanceVariance(bitmap) > 100, "the picture is blank or nearly so");
    }

    /// <summary>Variance of luminance over a grid of samples (0-255 scale).</summary>
    public static double LuminanceVariance(SKBitmap bitmap)
    {
        double sum = 0, sumSq = 0;
        int n = 0;
        for (int y = 0; y < bitmap.Height; y += 3)
        {
            for (int x = 0; x < bitmap.Width; x += 3)
            {
                var c = bitmap.GetPixel(x, y);
                double l = (0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue);
                sum += l;
                sumSq += l * l;
                n++;
            }
        }

        double mean = sum / n;
        return (sumSq / n) - (mean * mean);
    }
}
