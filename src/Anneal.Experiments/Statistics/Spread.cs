using MathNet.Numerics.Distributions;
using MathNet.Numerics.Statistics;

namespace Anneal.Experiments.Statistics;

/// <summary>
/// Median, quartiles and mean with a two-sided 95% confidence interval (Student t, n − 1 degrees of freedom) of one
/// sample. Quartiles interpolate between order statistics (Hyndman &amp; Fan 1996, definition 7; R's default), as the plots do.
/// </summary>
public sealed record Spread(int Count, double Median, double Q1, double Q3, double Mean, double CiLow, double CiHigh)
{
    public double Iqr => Q3 - Q1;

    /// <summary>The spread of <paramref name="values"/>; the interval is NaN for fewer than two values.</summary>
    public static Spread Of(IReadOnlyList<double> values)
    {
        if (values.Count == 0)
        {
            return new Spread(0, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        var sorted = values.ToArray();
        Array.Sort(sorted);
        double mean = sorted.Mean();
        double half = double.NaN;
        if (sorted.Length >= 2)
        {
            half = TQuantile(0.975, sorted.Length - 1) * sorted.StandardDeviation() / Math.Sqrt(sorted.Length);
        }

        return new Spread(sorted.Length,
            SortedArrayStatistics.QuantileCustom(sorted, 0.5, QuantileDefinition.R7),
            SortedArrayStatistics.QuantileCustom(sorted, 0.25, QuantileDefinition.R7),
            SortedArrayStatistics.QuantileCustom(sorted, 0.75, QuantileDefinition.R7),
            mean, mean - half, mean + half);
    }

    /// <summary>The p-quantile of Student's t distribution with <paramref name="df"/> degrees of freedom.</summary>
    public static double TQuantile(double p, int df) => StudentT.InvCDF(0, 1, df, p);
}
