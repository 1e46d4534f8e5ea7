using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

public class CvrplibReaderTests
{
    [Fact]
    public void Reads_nodes_demands_and_an_unlimited_fleet()
    {
        var inst = CvrplibReader.Parse(SampleTexts.Cvrplib, "tiny.vrp");

        Assert.True(CvrplibReader.LooksLike(SampleTexts.Cvrplib));
        Assert.False(SolomonReader.LooksLike(SampleTexts.Cvrplib));
        Assert.Equal("tiny-n5", inst.Name);

        // Customer numbers as CVRPLIB solution files write them: node number minus one.
        Assert.Equal(["1", "2", "3", "4"], inst.Stops.Select(s => s.Id));
        Assert.Equal([10.0, 15, 5, 20], inst.Stops.Select(s => s.Demand[0]));
        Assert.All(inst.Stops, s => Assert.Equal(TimeWindow.Always, Assert.Single(s.Windows)));

        // CVRPLIB fleets are unlimited: one vehicle per customer is never binding.
        Assert.Equal(4, inst.Vehicles.Count);
        Assert.All(inst.Vehicles, v => Assert.Equal((30.0, double.PositiveInfinity), (v.Capacity[0], v.ShiftEnd)));
        Assert.Equal(DistanceRule.EuclideanRounded, inst.Travel.Rule);
        Assert.Equal(Objective.Distance, inst.Objective);
    }

    [Fact]
    public void Distances_are_rounded_to_the_nearest_integer()
    {
        // TSPLIB 95 (Reinelt 1991) EUC_2D: nint(sqrt(dx^2 + dy^2)). Node 2 (3,4) to node 5 (0,10): sqrt(45) = 6.708 -> 7.
        var inst = CvrplibReader.Parse(SampleTexts.Cvrplib, "tiny.vrp");
        Assert.Equal(7, inst.Travel.Distance(0, 3));
        Assert.Equal(5, inst.Travel.Distance(inst.DepotLocation(0), 0));
    }

    [Fact]
    public void Vehicles_keyword_sets_the_fleet_and_tabs_and_crlf_are_accepted()
    {
        string text = SampleTexts.Cvrplib.Replace("CAPACITY : 30\n", "CAPACITY:\t30\nVEHICLES : 2\n").Replace(" ", "\t").Replace("\n", "\r\n");
        var inst = CvrplibReader.Parse(text, "tiny.vrp");
        Assert.Equal(2, inst.Vehicles.Count);
        Assert.Equal(4, inst.StopCount);
    }

    [Fact]
    public void Only_euc_2d_is_supported()
    {
        var e = Assert.Throws<InputException>(() => CvrplibReader.Parse(SampleTexts.Cvrplib.Replace("EUC_2D", "GEO"), "geo.vrp"));
        var p = Assert.Single(e.Problems);
        Assert.Equal(("geo.vrp", 5, "EDGE_WEIGHT_TYPE", "GEO"), (p.File, p.Row, p.Column, p.Value));
        Assert.Contains("only EUC_2D", p.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_bad_row_is_reported()
    {
        string bad = SampleTexts.Cvrplib.Replace(" 3 6 8\n", " 3 6 inf\n").Replace("4 5\n", "4 -5\n").Replace(" 5 0 10\n", " 2 0 10\n");
        var e = Assert.Throws<InputException>(() => CvrplibReader.Parse(bad, "bad.vrp"));
        Assert.Contains(e.Problems, p => p is { Row: 10, Column: "y", Value: "inf" });
        Assert.Contains(e.Problems, p => p is { Row: 12, Column: "NODE_COORD_SECTION", Value: "2" });
        Assert.Contains(e.Problems, p => p is { Row: 17, Column: "demand", Value: "-5" });
    }

    [Theory]
    [InlineData("DIMENSION : 5", "DIMENSION : 6", "NODE_COORD_SECTION")]
    [InlineData("DIMENSION : 5", "DIMENSION : 4", "NODE_COORD_SECTION")]
    [InlineData("DIMENSION : 5\n", "", "DIMENSION")]
    [InlineData(" 1\n -1\n", " 1\n 2\n -1\n", "DEPOT_SECTION")]
    [InlineData("DEPOT_SECTION\n 1\n -1\n", "", "DEPOT_SECTION")]
    [InlineData("TYPE : CVRP", "TYPE : TSP", "TYPE")]
    [InlineData("CAPACITY : 30", "CAPACITY : 1e400", "CAPACITY")]
    [InlineData("COMMENT", "EDGE_WEIGHT_FORMAT", "EDGE_WEIGHT_FORMAT")]
    public void Structural_problems_name_the_field(string from, string to, string column)
    {
        var e = Assert.Throws<InputException>(() => CvrplibReader.Parse(SampleTexts.Cvrplib.Replace(from, to), "s.vrp"));
        Assert.Contains(e.Problems, p => p.Column == column);
        Assert.All(e.Problems, p => Assert.Equal("s.vrp", p.File));
    }

    [SkippableFact]
    public void Reads_a_published_instance()
    {
        // Augerat et al. (1995) A-n32-k5: 32 nodes including the depot, capacity 100.
        var inst = CvrplibReader.Parse(File.ReadAllText(BenchmarkData.File("cvrp/A-n32-k5.vrp")), "A-n32-k5.vrp");
        Assert.Equal(("A-n32-k5", 31, 100.0), (inst.Name, inst.StopCount, inst.Vehicles[0].Capacity[0]));
    }
}
