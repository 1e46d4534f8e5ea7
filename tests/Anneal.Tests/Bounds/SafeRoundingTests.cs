using System.Numerics;
using Anneal.Bounds.Safety;

namespace Anneal.Tests.Bounds;

/// <summary>A bound rounded down with <see cref="SafeRounding"/> stays below the exactly computed value.</summary>
public sealed class SafeRoundingTests
{
    private const int Scale = 60;

    [Theory]
    [InlineData(1, 10)]
    [InlineData(2, 10_000)]
    [InlineData(3, 300_000)]
    public void SafeSumIsBelowTheExactSum(int seed, int terms)
    {
        // Terms are dyadic (n / 2^k, exact as doubles) of widely different sizes, so the double sum rounds;
        // the reference sum is exact, in integers of 2^-60.
        var rng = new Random(seed);
        double sum = 0, magnitude = 0;
        var exact = BigInteger.Zero;
        for (int k = 0; k < terms; k++)
        {
            long n = rng.NextInt64(-3_000_000_000L, 10_000_000_000L);
            int shift = rng.Next(0, Scale);
            double t = n / Math.Pow(2, shift);
            sum += t;
            magnitude += Math.Abs(t);
            exact += new BigInteger(n) << (Scale - shift);
        }

        double safe = SafeRounding.Down(sum, magnitude);
        Assert.True(AtMost(safe, exact), $"safe {safe} is above the exact sum");
        Assert.True(sum - safe <= 1e-8 * Math.Max(1, magnitude), "the margin is small");
    }

    [Fact]
    public void NotANumberIsNoBound()
    {
        Assert.True(double.IsNaN(SafeRounding.Down(double.NaN, 1)));
        Assert.True(double.IsNaN(SafeRounding.Down(1, double.PositiveInfinity)));
    }

    [Fact]
    public void ZeroStaysAtOrBelowZero() => Assert.True(SafeRounding.Down(0, 0) <= 0);

    /// <summary>d ≤ exact / 2^60, compared exactly: d = mantissa × 2^exponent.</summary>
    private static bool AtMost(double d, BigInteger exact)
    {
        long bits = BitConverter.DoubleToInt64Bits(d);
        bool negative = bits < 0;
        int exponent = (int)((bits >> 52) & 0x7FF);
        long mantissa = bits & 0xFFFFFFFFFFFFFL;
        if (exponent == 0)
        {
            exponent = 1;
        }
        else
        {
            mantissa |= 1L << 52;
        }

        exponent -= 1075;
        var m = new BigInteger(negative ? -mantissa : mantissa);
        int e = exponent + Scale;
        return e >= 0 ? (m << e) <= exact : m <= (exact << -e);
    }
}
