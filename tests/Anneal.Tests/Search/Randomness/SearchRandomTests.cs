using Anneal.Search.Randomness;

namespace Anneal.Tests.Search.Randomness;

public class SearchRandomTests
{
    [Fact]
    public void TheSameSeedGivesTheSameSequenceAndAnotherSeedAnother()
    {
        var a = new SearchRandom(42);
        var b = new SearchRandom(42);
        var c = new SearchRandom(43);
        int differ = 0;
        for (int k = 0; k < 1000; k++)
        {
            int x = a.Next(1_000_000);
            Assert.Equal(x, b.Next(1_000_000));
            differ += x != c.Next(1_000_000) ? 1 : 0;
        }

        Assert.True(differ > 990);
    }

    // Uniformity by Pearson's chi-square over 10 cells, 100,000 draws: the 0.999 quantile of chi-square with
    // 9 degrees of freedom is 27.88 (standard tables), so a fair generator fails this about once in a thousand
    // seeds; the seeds are fixed, so the test is deterministic.
    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    public void BoundedDrawsStayInRangeAndAreUniform(int seed)
    {
        var rng = new SearchRandom(seed);
        var counts = new int[10];
        const int draws = 100_000;
        for (int k = 0; k < draws; k++)
        {
            int x = rng.Next(10);
            Assert.InRange(x, 0, 9);
            counts[x]++;
            Assert.InRange(rng.Next(3, 5), 3, 4);
            double d = rng.NextDouble();
            Assert.True(d >= 0 && d < 1);
        }

        double expected = draws / 10.0;
        double chi = counts.Sum(c => (c - expected) * (c - expected) / expected);
        Assert.True(chi < 27.88, $"chi-square {chi:F2} over counts {string.Join(",", counts)}");
    }
}
