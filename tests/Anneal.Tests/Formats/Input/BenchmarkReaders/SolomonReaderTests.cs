using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

public class SolomonReaderTests
{
    [Fact]
    public void Reads_the_depot_fleet_and_stops()
    {
        var inst = SolomonReader.Parse(SampleTexts.Solomon, "tiny.txt");

        Assert.Equal("TINY1", inst.Name);
        Assert.Equal(4, inst.StopCount);
        Assert.Equal(["1", "2", "3", "4"], inst.Stops.Select(s => s.Id));
        Assert.Equal(new TimeWindow(50, 200), Assert.Single(inst.Stops[1].Windows));
        Assert.Equal(20, inst.Demand(1, 0));
        Assert.Equal(10, inst.ServiceTime(1));
        Assert.Equal(["demand"], inst.DimensionNames);
        Assert.Equal(3, inst.Vehicles.Count);
        Assert.All(inst.Vehicles, v => Assert.Equal((0.0, 500.0, 50.0), (v.ShiftStart, v.ShiftEnd, v.Capacity[0])));
        Assert.Equal("0", Assert.Single(inst.Depots).Id);
        Assert.Equal(Objective.Distance, inst.Objective);
        Assert.Equal(RuleSet.AllHard, inst.Rules);
        Assert.Equal(Units.Plain, inst.Units);
        Assert.Equal(DistanceRule.Euclidean, inst.Travel.Rule);

        // Stop 4 at (5,5) from the depot at (0,0): sqrt(50), unrounded (Solomon convention: double precision).
        Assert.Equal(Math.Sqrt(50), inst.Travel.Distance(inst.DepotLocation(0), 3), 12);
        Assert.Equal(Math.Sqrt(50), inst.Travel.Duration(inst.DepotLocation(0), 3), 12);
    }

    [Fact]
    public void Crlf_tabs_and_extra_blanks_read_the_same()
    {
        string messy = SampleTexts.Solomon.Replace("\n", "\r\n").Replace("      ", "\t  ");
        var a = SolomonReader.Parse(SampleTexts.Solomon, "a.txt");
        var b = SolomonReader.Parse(messy, "b.txt");
        Assert.True(SolomonReader.LooksLike(messy));
        Assert.Equal(a.Stops.Select(s => (s.Id, s.X, s.Y, s.Windows[0])), b.Stops.Select(s => (s.Id, s.X, s.Y, s.Windows[0])));
    }

    [Fact]
    public void Without_a_name_line_the_file_name_is_used()
    {
        var inst = SolomonReader.Parse(SampleTexts.Solomon.Replace("TINY1\n", string.Empty), "dir/tiny.txt");
        Assert.Equal("tiny.txt", inst.Name);
    }

    [Fact]
    public void Every_bad_row_is_reported_with_row_column_and_value()
    {
        string bad = SampleTexts.Solomon
            .Replace("    2     10        10         20", "    2     10        10        -20")
            .Replace("    3     10         0         30          0        300", "    3     NaN        0         30          0        300")
            .Replace("    4      5         5         15         20         80", "    1      5         5         15         90         80");
        var e = Assert.Throws<InputException>(() => SolomonReader.Parse(bad, "bad.txt"));

        Assert.All(e.Problems, p => Assert.Equal("bad.txt", p.File));
        Assert.Contains(e.Problems, p => p is { Row: 12, Column: "DEMAND", Value: "-20" });
        Assert.Contains(e.Problems, p => p is { Row: 13, Column: "XCOORD.", Value: "NaN" });
        Assert.Contains(e.Problems, p => p is { Row: 14, Column: "DUE DATE", Value: "80" });
        Assert.All(e.Problems, p => Assert.False(string.IsNullOrWhiteSpace(p.Fix)));
    }

    [Fact]
    public void A_duplicate_customer_number_names_both_rows()
    {
        string dup = SampleTexts.Solomon.Replace("    4      5         5", "    2      5         5");
        var e = Assert.Throws<InputException>(() => SolomonReader.Parse(dup, "dup.txt"));
        var p = Assert.Single(e.Problems);
        Assert.Equal((14, "CUST NO.", "2"), (p.Row, p.Column, p.Value));
        Assert.Contains("row 12", p.Problem, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("  3         50\n", "  1e300         50\n", "NUMBER")]
    [InlineData("  3         50\n", "  3         Infinity\n", "CAPACITY")]
    [InlineData("  3         50\n", "  3\n", "NUMBER CAPACITY")]
    [InlineData("CUSTOMER\n", "CUSTOMERS\n", "CUSTOMER")]
    [InlineData("    0      0         0          0          0        500          0\n", "    7      0         0          0          0        500          0\n", "CUST NO.")]
    public void Malformed_fleet_or_sections_are_input_problems(string from, string to, string column)
    {
        var e = Assert.Throws<InputException>(() => SolomonReader.Parse(SampleTexts.Solomon.Replace(from, to), "f.txt"));
        Assert.Contains(e.Problems, p => p.Column == column);
    }

    [SkippableFact]
    public void Reads_c101_and_a_crlf_homberger_file()
    {
        // Sizes as published: Solomon (1987) c101 has 100 customers and 25 vehicles of capacity 200;
        // Gehring & Homberger (1999) c1_2_1 has 200 customers and 50 vehicles.
        var c101 = SolomonReader.Parse(File.ReadAllText(BenchmarkData.File("solomon/c101.txt")), "c101.txt");
        Assert.Equal(("C101", 100, 25, 200.0), (c101.Name, c101.StopCount, c101.Vehicles.Count, c101.Vehicles[0].Capacity[0]));
        Assert.Equal(1236, c101.Vehicles[0].ShiftEnd);

        var text = File.ReadAllText(BenchmarkData.File("homberger/c1_2_1.txt"));
        Assert.Contains("\r\n", text, StringComparison.Ordinal);
        var c121 = SolomonReader.Parse(text, "c1_2_1.txt");
        Assert.Equal(("c1_2_1", 200, 50), (c121.Name, c121.StopCount, c121.Vehicles.Count));
    }
}
