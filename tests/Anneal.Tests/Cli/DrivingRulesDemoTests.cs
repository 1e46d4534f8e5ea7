using System.Globalization;
using Anneal.Cli;

namespace Anneal.Tests.Cli;

/// <summary>
/// The driving-rules demo (instances/marl-valley-hours, every vehicle under eu-561) through `solve`, its routes.csv
/// re-checked by a reader of its own that knows only the file and the rule's numbers, not the evaluator: no more than
/// 270 min of `drive` without a break row of 45 min, or of 15 min followed later by one of 30 min; at most 540 min of
/// `drive` per route (Regulation (EC) No 561/2006 Art. 7 and 6(1), values from memory). The report shows the breaks.
/// </summary>
public sealed class DrivingRulesDemoTests : CommandTest
{
    private static string Demo => Path.Combine(BenchmarkData.RepoRoot, "instances", "marl-valley-hours");

    [Fact]
    public void Every_route_of_the_demo_passes_an_independent_check_of_the_eu_rules()
    {
        string outDir = Path.Combine(Dir, "run");

        int code = CliApp.Run(["solve", Demo, "--solvers", "insertion,sa", "--iterations", "1500", "--time", "60", "--quiet", "--out", outDir], Out, Err);

        Assert.True(code == ExitCodes.Success, All);
        var rows = Rows(Path.Combine(outDir, "routes.csv"));
        int breaks = 0;
        foreach (var route in rows.GroupBy(r => r["vehicle"]))
        {
            breaks += Check(route.Key, route.ToList());
        }

        Assert.True(breaks > 0, "the demo's routes are long enough to need breaks");
        string report = File.ReadAllText(Path.Combine(outDir, "report.html"));
        Assert.Contains("<tr class=\"break\">", report, StringComparison.Ordinal);
        Assert.Contains("eu-561 (Regulation (EC) No 561/2006", report, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_says_which_driving_rules_the_vehicles_work_under()
    {
        int code = CliApp.Run(["check", Demo], Out, Err);

        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("driving rules eu-561 (Regulation (EC) No 561/2006 Art. 6, 7 and 8): hard; 17 vehicle(s); a break of 45 min (or 15 then 30) after 270 min of driving", Out.ToString(), StringComparison.Ordinal);
    }

    /// <summary>Checks one vehicle's rows in file order; returns its number of break rows.</summary>
    private static int Check(string vehicle, List<Dictionary<string, string>> rows)
    {
        double stretch = 0, day = 0;
        bool firstPart = false;
        int breaks = 0;
        foreach (var row in rows)
        {
            double drive = double.Parse(row["drive"], CultureInfo.InvariantCulture);
            stretch += drive;
            day += drive;
            Assert.True(stretch <= 270 + 0.05, $"{vehicle}: {stretch:0.##} min of driving without a full break, up to row {row["sequence"]}");
            if (row["kind"] != "break")
            {
                continue;
            }

            breaks++;
            Assert.Equal(string.Empty, row["stop"]);
            double minutes = Clock(row["departure"]) - Clock(row["start"]);

            // Clock times are written to the minute, so a length may read half a minute short.
            if (minutes >= 45 - 0.5 || (firstPart && minutes >= 30 - 0.5))
            {
                stretch = 0;
                firstPart = false;
            }
            else if (minutes >= 15 - 0.5)
            {
                firstPart = true;
            }
        }

        Assert.True(day <= 540 + 0.05, $"{vehicle}: {day:0.##} min of driving in the day");
        return breaks;
    }

    private static double Clock(string hhmm)
    {
        var parts = hhmm.Split(':');
        return (int.Parse(parts[0], CultureInfo.InvariantCulture) * 60) + int.Parse(parts[1], CultureInfo.InvariantCulture);
    }

    /// <summary>routes.csv as rows of named cells (its fields hold no quoted commas but the break's name, handled here).</summary>
    private static List<Dictionary<string, string>> Rows(string path)
    {
        var lines = File.ReadAllLines(path);
        var header = Split(lines[0]);
        var rows = new List<Dictionary<string, string>>();
        foreach (var line in lines.Skip(1))
        {
            var cells = Split(line);
            rows.Add(header.Select((h, i) => (h, cells[i])).ToDictionary(x => x.h, x => x.Item2));
        }

        return rows;
    }

    private static List<string> Split(string line)
    {
        var cells = new List<string>();
        var cell = new System.Text.StringBuilder();
        bool quoted = false;
        foreach (char c in line)
        {
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (c == ',' && !quoted)
            {
                cells.Add(cell.ToString());
                cell.Clear();
            }
            else
            {
                cell.Append(c);
            }
        }

        cells.Add(cell.ToString());
        return cells;
    }
}
