using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.Csv;

namespace Anneal.Tests.Formats.Input.Ranges;

/// <summary>No message quotes more than about 80 characters of a value (issue 19: a 100,000-character cell gave a 100 KB error line).</summary>
public class LongValueTests
{
    [Fact]
    public void A_huge_cell_is_quoted_by_its_start_and_length_only()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = RangeTests.SetCell(files["stops.csv"], 2, "service", new string('9', 50_000) + "x" + new string('7', 50_000));
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        var line = Assert.Single(e.Problems).ToString();
        Assert.True(line.Length < 400, line);
        Assert.Contains("100,001 characters", line, StringComparison.Ordinal);
    }

    [Fact]
    public void A_huge_id_is_refused_and_quoted_short()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = RangeTests.SetCell(files["stops.csv"], 2, "id", new string('a', 100_000));
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        Assert.All(e.Problems, p => Assert.True(p.ToString().Length < 1000, p.ToString()));
        Assert.Contains(e.Problems, p => p.Column == "id" && p.Fix.Contains("at most 100 characters", StringComparison.Ordinal));
    }
}
