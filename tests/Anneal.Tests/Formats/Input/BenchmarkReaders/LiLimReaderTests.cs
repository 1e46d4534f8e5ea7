using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

/// <summary>The Li &amp; Lim pickup-and-delivery format (Li &amp; Lim 2001, Proc. 13th IEEE ICTAI), on the shared files and on small texts.</summary>
public class LiLimReaderTests
{
    private const string Tiny = """
        2	50	1
        0	0	0	0	0	1000	0	0	0
        1	10	0	-5	0	500	3	2	0
        2	5	0	5	0	500	3	0	1
        """;

    [Fact]
    public void A_pickup_becomes_a_collection_and_its_delivery_collects_from_it()
    {
        var inst = LiLimReader.Parse(Tiny, "tiny.txt");

        Assert.Equal(["1", "2"], inst.Stops.Select(s => s.Id));
        Assert.Equal(1, inst.Stops[0].CollectFrom);
        Assert.Equal(-1, inst.Stops[1].CollectFrom);
        Assert.Equal(5, inst.Demand(0, 0));
        Assert.Equal(0, inst.DepotLoad(0, 0));
        Assert.Equal(5, inst.Pickup(1, 0));
        Assert.True(inst.HasPairs);
        Assert.True(inst.IsCollection(1));
        Assert.Equal(0, inst.Partner(1));
        Assert.Equal(2, inst.Vehicles.Count);
        Assert.Equal(Objective.VehiclesThenDistance, inst.Objective);
        Assert.True(LiLimReader.LooksLike(Tiny));
        Assert.False(SolomonReader.LooksLike(Tiny));
    }

    [SkippableTheory]
    [InlineData("lc101", 53, 25, 200)]
    [InlineData("lr1_2_1", 105, 50, 200)]
    public void Reads_the_shared_files_into_balanced_pairs(string name, int pairs, int vehicles, double capacity)
    {
        // Counts from the files themselves (lc101: 106 tasks after the depot; lr1_2_1: 210), header "25 200 1" / "50 200 1".
        var inst = LiLimReader.Parse(File.ReadAllText(BenchmarkData.File($"lilim/{name}.txt")), name + ".txt");

        Assert.Equal(pairs * 2, inst.StopCount);
        Assert.Equal(pairs, inst.Stops.Count(s => s.CollectFrom >= 0));
        Assert.Equal(vehicles, inst.Vehicles.Count);
        Assert.All(inst.Vehicles, v => Assert.Equal(capacity, v.Capacity[0]));
        for (int s = 0; s < inst.StopCount; s++)
        {
            if (inst.Stops[s].CollectFrom is int c and >= 0)
            {
                Assert.Equal(inst.Pickup(c, 0), inst.Demand(s, 0));
            }
        }
    }

    [Fact]
    public void A_link_that_is_not_returned_is_named_with_row_and_column()
    {
        string bad = Tiny.Replace("2\t5\t0\t5\t0\t500\t3\t0\t1", "2\t5\t0\t5\t0\t500\t3\t0\t7", StringComparison.Ordinal);

        var e = Assert.Throws<InputException>(() => LiLimReader.Parse(bad, "bad.txt"));

        var p = Assert.Single(e.Problems, p => p.Row == 4);
        Assert.Equal("delivery", p.Column);
        Assert.Contains("task 7 is not in the file", p.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Unbalanced_amounts_are_refused()
    {
        string bad = Tiny.Replace("-5", "-6", StringComparison.Ordinal);

        var e = Assert.Throws<InputException>(() => LiLimReader.Parse(bad, "bad.txt"));

        Assert.Contains(e.Problems, p => p.Column == "demand" && p.Problem.Contains("same amount negative", StringComparison.Ordinal));
    }
}
