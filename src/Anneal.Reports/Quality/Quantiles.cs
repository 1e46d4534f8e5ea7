namespace Anneal.Reports.Quality;

/// <summary>Sample quantiles by linear interpolation between order statistics (Hyndman &amp; Fan 1996, definition 7; R's default).</summary>
public static class Quantiles
{
    /// <param name="sorted">Values in ascending order; at least one.</param>
    /// <param name="p">Probability in [0, 1].</param>
    public static double Of(IReadOnlyList<double> sorted, double p)
    {
        if (sorted.Count == 0)
        {
            throw new ArgumentException("no values", nameof(sorted));
        }

        double h = (sorted.Count - 1) * Math.Clamp(p, 0, 1);
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, sorted.Count - 1);
        return sorted[lo] + ((h - lo) * (sorted[hi] - sorted[lo]));
    }
}
