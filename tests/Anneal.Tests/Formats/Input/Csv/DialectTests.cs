using System.Globalization;
using Anneal.Cli;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>
/// Files as a spreadsheet in a German-style locale exports them, written by a general-purpose CSV writer (CsvHelper)
/// with ';' as separator and a culture whose decimal separator is a comma; the same job written with ',' and dots
/// must give the same instance.
/// </summary>
public class DialectTests
{
    // The test process runs with invariant globalization, so the de-DE style is built: a comma for decimals.
    private static readonly CultureInfo DecimalComma = DecimalCommaCulture();

    private static CultureInfo DecimalCommaCulture()
    {
        var c = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        c.NumberFormat.NumberDecimalSeparator = ",";
        c.NumberFormat.NumberGroupSeparator = ".";
        return c;
    }

    private static readonly object[][] Stops =
    [
        ["id", "x", "y", "demand_kg", "service", "windows", "needs"],
        ["s1", 3.25, 4.5, 10.5, "0:10", "08:00-10:30;14:00-16:00", ""],
        ["s2", 6.0, 8.75, 20.0, 7.5, "09:00-12:00", "cold"],
        ["s3", 0.0, 10.0, 5.0, "", "", ""],
    ];

    private static readonly object[][] Depots = [["id", "x", "y"], ["hub", 0.5, 0.0]];

    private static readonly object[][] Vehicles =
    [
        ["id", "count", "capacity_kg", "shift_start", "shift_end", "cost_per_km", "equipment"],
        ["van", 2, 100.0, "07:30", "17:00:00", 0.45, ""],
        ["fridge", 1, 80.5, "08:00", "18:00", 0.5, "cold"],
    ];

    private static string Write(object[][] rows, string delimiter, CultureInfo culture)
    {
        using var text = new StringWriter();
        using (var csv = new CsvWriter(text, new CsvConfiguration(culture) { Delimiter = delimiter }))
        {
            foreach (var row in rows)
            {
                foreach (var cell in row)
                {
                    csv.WriteField(cell);
                }

                csv.NextRecord();
            }
        }

        return text.ToString();
    }

    private static JobFolder Job(string delimiter, CultureInfo culture) => new(new Dictionary<string, string>
    {
        ["stops.csv"] = Write(Stops, delimiter, culture),
        ["depots.csv"] = Write(Depots, delimiter, culture),
        ["vehicles.csv"] = Write(Vehicles, delimiter, culture),
    });

    [Fact]
    public void A_semicolon_export_with_decimal_commas_reads_like_the_comma_file()
    {
        using var semicolon = Job(";", DecimalComma);
        using var comma = Job(",", CultureInfo.InvariantCulture);
        Assert.Contains("3,25", File.ReadAllText(Path.Combine(semicolon.Path, "stops.csv")), StringComparison.Ordinal);

        var a = CsvJobReader.Read(semicolon.Path);
        var b = CsvJobReader.Read(comma.Path);

        Assert.Equal("semicolon-separated, decimal commas", a.ReadAs);
        Assert.Equal("comma-separated", b.ReadAs);
        Assert.Equal(b.Instance.Stops.Select(s => (s.X, s.Y, s.Demand[0], s.ServiceTime)), a.Instance.Stops.Select(s => (s.X, s.Y, s.Demand[0], s.ServiceTime)));
        Assert.Equal(b.Instance.Vehicles.Select(v => (v.Capacity[0], v.ShiftStart, v.ShiftEnd, v.CostPerDistance)),
            a.Instance.Vehicles.Select(v => (v.Capacity[0], v.ShiftStart, v.ShiftEnd, v.CostPerDistance)));

        var s1 = a.Instance.Stops[0];
        Assert.Equal((3.25, 4.5, 10.5), (s1.X, s1.Y, s1.Demand[0]));
        Assert.Equal([new TimeWindow(480, 630), new TimeWindow(840, 960)], s1.Windows); // HH:MM, not decimals
        Assert.Equal(7.5, a.Instance.Stops[1].ServiceTime); // "7,5" minutes
        Assert.Equal(7 * 60 + 30, a.Instance.Vehicles[0].ShiftStart);
        Assert.Equal(17 * 60, a.Instance.Vehicles[0].ShiftEnd); // 17:00:00, as spreadsheets export a time cell
        Assert.Equal(0.45, a.Instance.Vehicles[0].CostPerDistance);
    }

    [Fact]
    public void A_tab_separated_export_is_read()
    {
        using var tab = Job("\t", DecimalComma);
        var loaded = CsvJobReader.Read(tab.Path);

        Assert.Equal("tab-separated, decimal commas", loaded.ReadAs);
        Assert.Equal(80.5, loaded.Instance.Vehicles[2].Capacity[0]);
    }

    [Fact]
    public void A_number_with_a_thousands_separator_is_refused_not_guessed()
    {
        var files = JobFolder.ValidPlanar();
        files.Remove("settings.json");
        files["stops.csv"] = "id;x;y;demand_kg\ns1;1.234,5;2;1\n";
        files["depots.csv"] = "id;x;y\nhub;0;0\n";
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        var bad = Assert.Single(p);
        Assert.Equal(("stops.csv", 2, "x", "1.234,5"), (bad.File, bad.Row, bad.Column, bad.Value));
        Assert.Contains("12,5", bad.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void A_file_saved_in_windows_1252_keeps_its_accents()
    {
        using var job = Job(";", DecimalComma);
        System.Text.Encoding.RegisterProvider(System.Text.CodePagesEncodingProvider.Instance);
        var latin = System.Text.Encoding.GetEncoding(1252); // the code page of Western European spreadsheet "CSV" saves
        File.WriteAllBytes(Path.Combine(job.Path, "depots.csv"), latin.GetBytes("id;x;y\nCafé Entrepôt;0,5;0\n"));

        var loaded = CsvJobReader.Read(job.Path);

        Assert.Equal("Café Entrepôt", loaded.Instance.Depots[0].Id);
        Assert.Contains("depots.csv semicolon-separated, decimal commas, Windows-1252", loaded.ReadAs, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_says_which_dialect_it_read()
    {
        using var semicolon = Job(";", DecimalComma);
        var output = new StringWriter();

        Assert.Equal(ExitCodes.Success, CliApp.Run(["check", semicolon.Path], output, new StringWriter()));
        Assert.Contains("valid (csv-job, semicolon-separated, decimal commas)", output.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_field_count_mismatch_names_the_separator_it_read()
    {
        var files = JobFolder.ValidPlanar();
        files["depots.csv"] = "id;x;y\nhub;0\n";
        using var job = new JobFolder(files);

        var problems = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        var p = Assert.Single(problems, x => x.File == "depots.csv" && x.Problem.Contains("fields", StringComparison.Ordinal));
        Assert.Contains("semicolon-separated", p.Problem, StringComparison.Ordinal);
        Assert.Contains("semicolons", p.Fix, StringComparison.Ordinal);
    }
}
