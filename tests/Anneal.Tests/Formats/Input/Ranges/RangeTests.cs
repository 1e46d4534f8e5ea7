using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.BenchmarkReaders;
using Anneal.Tests.Formats.Input.Csv;

namespace Anneal.Tests.Formats.Input.Ranges;

/// <summary>
/// Every number has an accepted range (<see cref="Limits"/>, listed in the README), enforced by the readers with the
/// usual located message. The values are the ones that once passed `check` and then aborted OR-Tools or printed
/// absurd clocks (issue 19: 1e308 coordinates, services and shift ends; 1e8 coordinates; cost_per_km 1e308).
/// </summary>
public class RangeTests
{
    public static TheoryData<string, string, string, string> CsvCases() => new()
    {
        // file, column, value, what the fix must name
        { "stops.csv", "x", "1e308", "km" },
        { "stops.csv", "x", "1e8", "km" },
        { "stops.csv", "y", "-20001", "km" },
        { "stops.csv", "service", "1e308", "minutes" },
        { "stops.csv", "service", "1441", "minutes" },
        { "stops.csv", "demand_kg", "1e10", "units" },
        { "stops.csv", "penalty", "1e308", "1,000,000" },
        { "vehicles.csv", "shift_end", "1e308", "2880" },
        { "vehicles.csv", "shift_end", "2881", "2880" },
        { "vehicles.csv", "shift_start", "99999", "2880" },
        { "vehicles.csv", "max_duration", "100:00", "minutes" },
        { "vehicles.csv", "capacity_kg", "1e300", "units" },
        { "vehicles.csv", "cost_per_km", "1e308", "1,000,000" },
        { "vehicles.csv", "fixed_cost", "2e6", "1,000,000" },
        { "vehicles.csv", "cost_per_hour", "1e7", "1,000,000" },
        { "depots.csv", "x", "1e8", "km" },
    };

    [Theory]
    [MemberData(nameof(CsvCases))]
    public void A_csv_number_outside_its_range_is_refused_with_file_row_column_value_and_fix(string file, string column, string value, string fix)
    {
        var files = JobFolder.ValidPlanar();
        files[file] = SetCell(files[file], row: 2, column, value);
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        var p = Assert.Single(e.Problems);
        Assert.Equal(file, p.File);
        Assert.Equal(2, p.Row);
        Assert.Equal(column, p.Column);
        Assert.Equal(value, p.Value);
        Assert.Contains(fix, p.Problem + p.Fix, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("08:00-1e308")]
    [InlineData("3000-3100")]
    public void A_window_past_the_next_day_is_refused(string windows)
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = SetCell(files["stops.csv"], row: 2, "windows", windows);
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        var p = Assert.Single(e.Problems);
        Assert.Equal(("stops.csv", "windows"), (p.File, p.Column));
        Assert.Contains("2880", p.Fix, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\"timeSeconds\": 1e308", "timeSeconds")]
    [InlineData("\"travel\": { \"speedKmh\": 1e6 }", "travel.speedKmh")]
    [InlineData("\"travel\": { \"detourFactor\": 0.2 }", "travel.detourFactor")]
    [InlineData("\"rules\": { \"shiftEnd\": { \"hard\": false, \"pricePerMinute\": 1e308 } }", "rules.shiftEnd.pricePerMinute")]
    public void A_settings_number_outside_its_range_is_refused(string member, string key)
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = "{ " + member + " }";
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        var p = Assert.Single(e.Problems);
        Assert.Equal(("settings.json", key), (p.File, p.JsonPath));
        Assert.Contains("outside the accepted range", p.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Matrix_trips_longer_than_the_planet_or_the_two_days_are_refused()
    {
        var files = JobFolder.ValidPlanar();
        var ids = new[] { "s1", "s2", "s3", "hub" };
        var lines = new List<string> { "from,to,distance,duration" };
        foreach (var a in ids)
        {
            foreach (var b in ids.Where(b => b != a))
            {
                lines.Add($"{a},{b},5,10");
            }
        }

        lines[1] = "s1,s2,1e308,10";
        lines[2] = "s1,s3,5,1e308";
        files["matrix.csv"] = string.Join('\n', lines) + "\n";
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));

        Assert.Equal([("distance", 2), ("duration", 3)], e.Problems.Select(p => (p.Column!, p.Row!.Value)).Order());
    }

    [Theory]
    [InlineData(1, "1e8")] // x
    [InlineData(3, "1e10")] // demand
    [InlineData(5, "1e308")] // due date: parsed as finite only below 1e15, so 1e12 is the in-between case below
    [InlineData(5, "1e12")]
    [InlineData(6, "2e7")] // service
    public void Solomon_values_outside_their_range_are_refused(int column, string value)
    {
        var lines = SampleTexts.Solomon.Split('\n');
        int row = Array.FindIndex(lines, l => l.TrimStart().StartsWith("1 ", StringComparison.Ordinal) && l.Contains("100", StringComparison.Ordinal));
        var cells = lines[row].Split(' ', StringSplitOptions.RemoveEmptyEntries);
        cells[column] = value;
        lines[row] = string.Join("  ", cells);

        var e = Assert.Throws<InputException>(() => SolomonReader.Parse(string.Join('\n', lines), "tiny.txt"));

        var p = Assert.Single(e.Problems);
        Assert.Equal(row + 1, p.Row);
        Assert.Equal(value, p.Value);
    }

    [Theory]
    [InlineData(" 3 6 8\n", " 3 6e7 8\n", "x")]
    [InlineData("3 15\n", "3 1e10\n", "demand")]
    [InlineData("CAPACITY : 30\n", "CAPACITY : 1e12\n", "CAPACITY")]
    public void Cvrplib_values_outside_their_range_are_refused(string line, string replacement, string column)
    {
        var text = SampleTexts.Cvrplib.Replace(line, replacement, StringComparison.Ordinal);

        var e = Assert.Throws<InputException>(() => CvrplibReader.Parse(text, "tiny.vrp"));

        Assert.Contains(e.Problems, p => p.Column == column && p.Problem.Contains("outside the accepted range", StringComparison.Ordinal));
    }

    [Fact]
    public void The_largest_accepted_values_still_load()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = SetCell(files["stops.csv"], 2, "x", "20000");
        files["stops.csv"] = SetCell(files["stops.csv"], 2, "service", "1440");
        files["stops.csv"] = SetCell(files["stops.csv"], 3, "penalty", "1000000");
        files["vehicles.csv"] = SetCell(files["vehicles.csv"], 2, "shift_end", "47:59");
        files["vehicles.csv"] = SetCell(files["vehicles.csv"], 2, "capacity_kg", "1e9");
        using var job = new JobFolder(files);

        var inst = CsvJobReader.Read(job.Path).Instance;

        Assert.Equal(20000, inst.Stops[0].X);
        Assert.Equal(47 * 60 + 59, inst.Vehicles[0].ShiftEnd);
    }

    /// <summary>The CSV text with one cell replaced (row 1 is the header; no quoted commas in the rows touched).</summary>
    internal static string SetCell(string csv, int row, string column, string value)
    {
        var lines = csv.Split('\n');
        var header = lines[0].Split(',');
        int c = Array.IndexOf(header, column);
        Assert.True(c >= 0, $"no column {column}");
        var cells = lines[row - 1].Split(',');
        cells[c] = value;
        lines[row - 1] = string.Join(',', cells);
        return string.Join('\n', lines);
    }
}
