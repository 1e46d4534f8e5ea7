using MathNet.Numerics.Distributions;
using MathNet.Numerics.Statistics;

namespace Anneal.Experiments.Statistics;

/// <summary>How the p-value of a signed-rank test is found.</summary>
public enum PValueMethod
{
    /// <summary>Exact up to <see cref="WilcoxonSignedRank.ExactLimit"/> non-zero pairs, normal approximation above.</summary>
    Auto,
    Exact,
    Normal,
}

/// <summary>
/// The Wilcoxon signed-rank test for paired samples (Wilcoxon 1945; Hollander &amp; Wolfe, Nonparametric Statistical
/// Methods, ch. 3). MathNet.Numerics 5.0 has no rank tests, so it is written here. Zero differences are dropped,
/// tied magnitudes get their average rank. The exact p-value enumerates the permutation distribution of W+ over the
/// observed ranks (so it stays exact under ties); the normal approximation uses the tie-corrected variance and a
/// continuity correction of 1/2, as R's wilcox.test does.
/// </summary>
public static class WilcoxonSignedRank
{
    /// <summary>Above this many non-zero pairs the normal approximation is used (the exact counts grow as 2^n).</summary>
    public const int ExactLimit = 30;

    // Differences closer to zero than this, and magnitudes closer than this, count as zero and as tied.
    private const double Tolerance = 1e-9;

    public static WilcoxonResult Test(IReadOnlyList<double> a, IReadOnlyList<double> b, PValueMethod method = PValueMethod.Auto)
    {
        if (a.Count != b.Count)
        {
            throw new ArgumentException("paired samples need the same length", nameof(b));
        }

        var all = new double[a.Count];
        var nonZero = new List<double>(a.Count);
        for (int i = 0; i < a.Count; i++)
        {
            all[i] = a[i] - b[i];
            if (Math.Abs(all[i]) > Tolerance)
            {
                nonZero.Add(all[i]);
            }
        }

        double medianDiff = all.Length > 0 ? all.Median() : double.NaN;
        int n = nonZero.Count;
        int zeros = a.Count - n;
        if (n == 0)
        {
            return new WilcoxonResult(0, zeros, 0, 0, double.NaN, true, null, medianDiff);
        }

        var (doubledRanks, tieGroups) = DoubledRanks(nonZero);
        int plus2 = 0;
        for (int i = 0; i < n; i++)
        {
            if (nonZero[i] > 0)
            {
                plus2 += doubledRanks[i];
            }
        }

        double wPlus = plus2 / 2.0, wMinus = (n * (n + 1) / 2.0) - wPlus;
        bool exact = method == PValueMethod.Exact || (method == PValueMethod.Auto && n <= ExactLimit);
        if (exact)
        {
            return new WilcoxonResult(n, zeros, wPlus, wMinus, ExactP(doubledRanks, plus2), true, null, medianDiff);
        }

        var (p, z) = NormalP(n, wPlus, tieGroups);
        return new WilcoxonResult(n, zeros, wPlus, wMinus, p, false, z, medianDiff);
    }

    /// <summary>Ranks of |d| (average ranks for ties) times two, so they are whole numbers; and the sizes of the tie groups.</summary>
    private static (int[] Ranks, List<int> Ties) DoubledRanks(List<double> d)
    {
        int n = d.Count;
        var order = new int[n];
        for (int i = 0; i < n; i++)
        {
            order[i] = i;
        }

        Array.Sort(order, (x, y) => Math.Abs(d[x]).CompareTo(Math.Abs(d[y])));
        var ranks = new int[n];
        var ties = new List<int>();
        for (int start = 0; start < n;)
        {
            int end = start + 1;
            while (end < n && Math.Abs(d[order[end]]) - Math.Abs(d[order[start]]) <= Tolerance)
            {
                end++;
            }

            // Positions start+1 … end share the rank (start + 1 + end) / 2; doubled it is start + 1 + end.
            for (int k = start; k < end; k++)
            {
                ranks[order[k]] = start + 1 + end;
            }

            ties.Add(end - start);
            start = end;
        }

        return (ranks, ties);
    }

    /// <summary>Two-sided exact p-value: 2 · min(P(W+ ≤ w), P(W+ ≥ w)), capped at 1 (R's convention).</summary>
    private static double ExactP(int[] doubledRanks, int observed2)
    {
        int total = 0;
        foreach (int r in doubledRanks)
        {
            total += r;
        }

        // counts[s] = number of sign assignments whose doubled W+ is s; 2^30 fits a double exactly.
        var counts = new double[total + 1];
        counts[0] = 1;
        int reach = 0;
        foreach (int r in doubledRanks)
        {
            for (int s = reach; s >= 0; s--)
            {
                if (counts[s] != 0)
                {
                    counts[s + r] += counts[s];
                }
            }

            reach += r;
        }

        double below = 0, above = 0, all = Math.Pow(2, doubledRanks.Length);
        for (int s = 0; s <= total; s++)
        {
            if (s <= observed2)
            {
                below += counts[s];
            }

            if (s >= observed2)
            {
                above += counts[s];
            }
        }

        return Math.Min(1, 2 * Math.Min(below, above) / all);
    }

    private static (double P, double Z) NormalP(int n, double wPlus, List<int> ties)
    {
        double mean = n * (n + 1) / 4.0;
        double tieSum = 0;
        foreach (int t in ties)
        {
            tieSum += ((double)t * t * t) - t;
        }

        double sd = Math.Sqrt((n * (n + 1) * ((2.0 * n) + 1) / 24.0) - (tieSum / 48.0));
        double diff = wPlus - mean;
        double z = (diff - (Math.Sign(diff) * 0.5)) / sd;
        double p = 2 * Math.Min(Normal.CDF(0, 1, z), 1 - Normal.CDF(0, 1, z));
        return (Math.Min(1, p), z);
    }
}
