namespace Anneal.Experiments.Statistics;

/// <summary>
/// The outcome of a Wilcoxon signed-rank test on paired differences a − b.
/// </summary>
/// <param name="Pairs">Pairs with a non-zero difference (zeros are dropped, as Wilcoxon 1945 and R do).</param>
/// <param name="Zeros">Pairs dropped because both sides were equal.</param>
/// <param name="WPlus">Sum of the ranks of the positive differences (R's V).</param>
/// <param name="WMinus">Sum of the ranks of the negative differences.</param>
/// <param name="PValue">Two-sided p-value; NaN when no pair differs.</param>
/// <param name="Exact">True when the p-value is from the exact distribution, false for the normal approximation.</param>
/// <param name="Z">The normal deviate (with continuity correction) when the approximation was used.</param>
/// <param name="MedianDifference">Median of the differences a − b over all pairs: negative means a is lower.</param>
public sealed record WilcoxonResult(int Pairs, int Zeros, double WPlus, double WMinus, double PValue, bool Exact, double? Z, double MedianDifference)
{
    /// <summary>-1 when a tends to be lower than b (a better, for a minimised value), +1 when higher, 0 when neither.</summary>
    public int Direction => WPlus < WMinus ? -1 : WPlus > WMinus ? 1 : 0;
}
