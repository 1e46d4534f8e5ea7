namespace Anneal.Bounds.Safety;

/// <summary>
/// Floating-point sums and LP values are only approximately what exact arithmetic would give. A bound is made safe by
/// taking off a margin that covers every rounding that could have raised it (after Neumaier &amp; Shcherbina 2004,
/// "Safe bounds in linear and mixed-integer linear programming", Math. Programming 99(2):283-296, who bound the
/// rounding of the dual objective the same way): a sum of m terms in double precision is off by at most
/// m·2⁻⁵³·Σ|terms|; 10⁻⁹ of the terms' magnitude covers up to a million terms with room to spare.
/// </summary>
public static class SafeRounding
{
    /// <summary>Relative margin taken off a bound; covers sums of up to 10⁶ terms in double precision.</summary>
    public const double RelativeMargin = 1e-9;

    /// <param name="value">The computed bound.</param>
    /// <param name="magnitude">Sum of the absolute values of every term that went into it.</param>
    public static double Down(double value, double magnitude)
    {
        if (!double.IsFinite(value) || !double.IsFinite(magnitude))
        {
            return double.NaN;
        }

        double margin = RelativeMargin * Math.Max(Math.Abs(value), Math.Abs(magnitude));
        return value - margin - double.Epsilon;
    }
}
