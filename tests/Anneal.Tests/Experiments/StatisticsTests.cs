using Anneal.Experiments.Statistics;

namespace Anneal.Tests.Experiments;

public sealed class StatisticsTests
{
    // Student (1908) "The probable error of a mean", Biometrika 6:1-25, as R's `sleep` data set: extra hours of sleep,
    // drug 1 (group 1) and drug 2 (group 2), the same ten patients.
    private static readonly double[] SleepGroup1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
    private static readonly double[] SleepGroup2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

    [Theory]
    // Two-sided 95% critical values of Student's t from any published table (e.g. Fisher & Yates, Statistical Tables, table III):
    [InlineData(1, 12.706)]
    [InlineData(2, 4.303)]
    [InlineData(9, 2.262)]
    [InlineData(10, 2.228)]
    [InlineData(30, 2.042)]
    [InlineData(120, 1.980)]
    public void T_quantile_matches_the_published_table(int df, double expected)
    {
        Assert.Equal(expected, Spread.TQuantile(0.975, df), 3);
    }

    [Fact]
    public void One_sided_t_quantile_matches_the_published_table()
    {
        // t(0.95, 10) = 1.812 (same tables, one-sided 5% column).
        Assert.Equal(1.812, Spread.TQuantile(0.95, 10), 3);
    }

    [Fact]
    public void Spread_of_the_sleep_data_matches_R()
    {
        var s = Spread.Of(SleepGroup1);

        // R: summary(sleep$extra[1:10]) → 1st Qu. -0.175, Median 0.350, Mean 0.750, 3rd Qu. 1.700 (quantile type 7);
        // t.test(sleep$extra[1:10]) → 95 percent confidence interval -0.5297804 2.0297804 (values from memory of R's output,
        // and they follow from mean ± t(0.975, 9) · sd / √10 with sd = 1.789010).
        Assert.Equal(10, s.Count);
        Assert.Equal(0.35, s.Median, 10);
        Assert.Equal(-0.175, s.Q1, 10);
        Assert.Equal(1.7, s.Q3, 10);
        Assert.Equal(1.875, s.Iqr, 10);
        Assert.Equal(0.75, s.Mean, 10);
        Assert.Equal(-0.5297804, s.CiLow, 6);
        Assert.Equal(2.0297804, s.CiHigh, 6);
    }

    [Fact]
    public void Spread_of_one_value_has_no_interval_and_of_none_is_empty()
    {
        var one = Spread.Of([4.0]);
        Assert.Equal(4.0, one.Median);
        Assert.True(double.IsNaN(one.CiLow));
        Assert.Equal(0, Spread.Of([]).Count);
    }

    [Fact]
    public void Wilcoxon_exact_matches_the_Hollander_and_Wolfe_example()
    {
        // Hollander & Wolfe (1973), Nonparametric Statistical Methods, p. 29: Hamilton depression scale before (x) and
        // after (y) a tranquilliser, nine patients; the example of R's wilcox.test help page, whose
        // wilcox.test(x, y, paired = TRUE, alternative = "greater") gives V = 40, p-value = 0.01953 (exactly 10/512).
        double[] x = [1.83, 0.50, 1.62, 2.48, 1.68, 1.88, 1.55, 3.06, 1.30];
        double[] y = [0.878, 0.647, 0.598, 2.05, 1.06, 1.29, 1.06, 3.14, 1.29];
        var r = WilcoxonSignedRank.Test(x, y);
        Assert.Equal(9, r.Pairs);
        Assert.Equal(40, r.WPlus);
        Assert.Equal(5, r.WMinus);
        Assert.True(r.Exact);
        Assert.Equal(2 * 10 / 512.0, r.PValue, 12); // two-sided = twice the one-sided 0.01953
        Assert.Equal(1, r.Direction); // x tends higher than y
    }

    [Fact]
    public void Wilcoxon_normal_approximation_matches_R_on_the_sleep_data()
    {
        // R: with(sleep, wilcox.test(extra[group == 2], extra[group == 1], paired = TRUE)) → V = 45, p-value = 0.009091
        // (normal approximation with continuity correction, as R falls back to it for ties and zeros; from memory of
        // R's output, and it follows from z = (45 − 22.5 − 0.5) / √(71.25 − 6/48)).
        var r = WilcoxonSignedRank.Test(SleepGroup2, SleepGroup1, PValueMethod.Normal);
        Assert.Equal(9, r.Pairs);
        Assert.Equal(1, r.Zeros);
        Assert.Equal(45, r.WPlus);
        Assert.False(r.Exact);
        Assert.Equal(0.009091, r.PValue, 5);
        Assert.Equal(2.6086, r.Z!.Value, 3);
    }

    [Theory]
    // Critical values T of the two-sided signed-rank test at α = 0.05: reject when min(W+, W−) ≤ T. Published tables
    // (e.g. Wilcoxon, Katti & Wilcox 1970, Selected Tables in Mathematical Statistics I; the common textbook table
    // gives n = 10 → 8, n = 15 → 25, n = 20 → 52; values from memory of such tables).
    [InlineData(10, 8)]
    [InlineData(15, 25)]
    [InlineData(20, 52)]
    public void Wilcoxon_exact_agrees_with_the_table_of_critical_values(int n, int critical)
    {
        Assert.True(PWithSmallerRankSum(n, critical) <= 0.05);
        Assert.True(PWithSmallerRankSum(n, critical + 1) > 0.05);
    }

    [Fact]
    public void Exact_and_normal_agree_closely_for_thirty_pairs()
    {
        var rng = new Random(3);
        var a = Enumerable.Range(0, 30).Select(_ => rng.NextDouble() + 0.15).ToArray();
        var b = Enumerable.Range(0, 30).Select(_ => rng.NextDouble()).ToArray();
        var exact = WilcoxonSignedRank.Test(a, b, PValueMethod.Exact);
        var normal = WilcoxonSignedRank.Test(a, b, PValueMethod.Normal);
        Assert.Equal(exact.WPlus, normal.WPlus);
        Assert.InRange(Math.Abs(exact.PValue - normal.PValue), 0, 0.01);
    }

    [Fact]
    public void Equal_samples_have_no_pairs_and_no_direction()
    {
        var r = WilcoxonSignedRank.Test([1.0, 2.0], [1.0, 2.0]);
        Assert.Equal(0, r.Pairs);
        Assert.Equal(2, r.Zeros);
        Assert.True(double.IsNaN(r.PValue));
        Assert.Equal(0, r.Direction);
    }

    /// <summary>Two-sided exact p when the differences are ±1 … ±n with negative ranks summing to <paramref name="wMinus"/>.</summary>
    private static double PWithSmallerRankSum(int n, int wMinus)
    {
        // The negatives: the largest ranks first, greedily, reach any sum up to n(n+1)/2.
        var negative = new HashSet<int>();
        int left = wMinus;
        for (int rank = n; rank >= 1 && left > 0; rank--)
        {
            if (rank <= left)
            {
                negative.Add(rank);
                left -= rank;
            }
        }

        var a = Enumerable.Range(1, n).Select(k => negative.Contains(k) ? -(double)k : k).ToArray();
        var r = WilcoxonSignedRank.Test(a, new double[n]);
        Assert.Equal(wMinus, r.WMinus);
        return r.PValue;
    }
}
