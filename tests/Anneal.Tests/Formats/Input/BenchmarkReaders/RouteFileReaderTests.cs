using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

public class RouteFileReaderTests
{
    private static readonly Anneal.Core.Model.Instance Tiny = SolomonReader.Parse(SampleTexts.Solomon, "tiny.txt");

    [Fact]
    public void Routes_get_vehicles_by_number_and_other_lines_are_ignored()
    {
        var plan = RouteFileReader.Parse(SampleTexts.SolomonRoutes.Replace("\n", "\r\n"), "tiny.sol", Tiny);

        Assert.Equal(3, plan.Routes.Count);
        Assert.Equal([0, 1, 2], plan.Routes.Select(r => r.Vehicle));
        Assert.Equal([3, 0], plan.Routes[0].Stops);
        Assert.Equal([1, 2], plan.Routes[1].Stops);
        Assert.Empty(plan.Routes[2].Stops);
    }

    [Fact]
    public void An_unknown_id_gives_the_row_and_value()
    {
        var e = Assert.Throws<InputException>(() => RouteFileReader.Parse("Cost 1\nRoute #1: 4 1\nRoute #2: 2 9 3\n", "r.sol", Tiny));
        var p = Assert.Single(e.Problems);
        Assert.Equal(("r.sol", 3, "Route #2", "9"), (p.File, p.Row, p.Column, p.Value));
    }

    [Fact]
    public void A_duplicate_id_gives_the_row_and_value_and_the_first_row()
    {
        var e = Assert.Throws<InputException>(() => RouteFileReader.Parse("Route #1: 4 1\nRoute #2: 2 1 3\n", "r.sol", Tiny));
        var p = Assert.Single(e.Problems);
        Assert.Equal((2, "1"), (p.Row, p.Value));
        Assert.Contains("row 1", p.Problem, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Route #1: 4 x1\n", 1, "x1")]
    [InlineData("Route #1: 4 1.5\n", 1, "1.5")]
    [InlineData("Route #1: 4\nRoute #4: 1\n", 2, "4")]
    [InlineData("Route #1: 4\nRoute #1: 1\n", 2, null)]
    [InlineData("Route #0: 4\n", 1, "0")]
    [InlineData("Route 1 4 1\n", 1, "Route 1 4 1")]
    [InlineData("Route #1: 0 4\n", 1, "0")]
    public void Bad_lines_are_located(string text, int row, string? value)
    {
        var e = Assert.Throws<InputException>(() => RouteFileReader.Parse(text, "r.sol", Tiny));
        Assert.Contains(e.Problems, p => p.Row == row && p.Value == value && p.File == "r.sol");
    }

    [Fact]
    public void A_missing_file_is_an_input_problem()
    {
        var e = Assert.Throws<InputException>(() => RouteFileReader.Read(Path.Combine(Path.GetTempPath(), "no-such-dir-anneal", "x.sol"), Tiny));
        Assert.Contains("x.sol", Assert.Single(e.Problems).File, StringComparison.Ordinal);
    }
}
