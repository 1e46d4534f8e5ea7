using Anneal.Cli;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Tests.Formats.Input.Csv;
using Anneal.Tests.Fixtures;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Formats.Input.Workbook;

/// <summary>
/// A job held as a workbook (sheets stops, depots, vehicles, settings), written by the Open XML SDK with cells typed
/// as numbers, times and booleans, reads as the same job as the CSV folder it mirrors (<see cref="JobFolder.ValidPlanar"/>).
/// </summary>
public sealed class WorkbookReaderTests : TempFolderTest
{
    private static readonly object?[]?[] Stops =
    [
        ["id", "x", "y", "demand_kg", "demand_m3", "service", "windows", "needs", "optional", "penalty", "note"],
        ["s1", 3, 4, 10, 1.5, TimeCell.At(0, 10), "08:00-10:30;14:00-16:00", null, false, null, "first"],
        ["s2", 6, 8, 20, null, 15, "09:00-12:00", "Cold", true, 90, null],
        ["s3", 0, 10, 5, 0.5, null, null, null, null, null, "quoted, with comma"],
    ];

    private static readonly object?[]?[] Depots = [["id", "x", "y"], ["hub", 0, 0]];

    private static readonly object?[]?[] Vehicles =
    [
        ["id", "count", "depot", "capacity_kg", "capacity_m3", "shift_start", "shift_end", "max_duration", "fixed_cost", "cost_per_km", "cost_per_hour", "equipment"],
        ["van", 2, "hub", 100, 8, TimeCell.At(7, 30), TimeCell.At(26, 15), new TimeCell(8 / 24.0, Hours: true), 50, 0.4, 22, null],
        ["fridge", 1, "hub", 80, 6, TimeCell.At(8, 0), TimeCell.At(18, 0), null, 70, 0.5, 25, "cold;lift"],
    ];

    private static readonly object?[]?[] Settings =
    [
        ["key", "value", "note"],
        ["objective", "distance", null],
        ["timeSeconds", 12, null],
        ["solvers", "sa, tabu", null],
        ["seed", 7, null],
        ["travel.speedKmh", 30, null],
        ["rules.timeWindows.hard", false, "a boolean cell"],
        ["rules.timeWindows.pricePerMinute", 2.5, null],
        ["rules.unserved.hard", "no", "a text cell"],
        ["rules.unserved.pricePerStop", 250, null],
    ];

    private string Book(string name = "north.xlsx", params (string, object?[]?[])[] sheets)
    {
        string path = Path.Combine(Dir, name);
        WorkbookFile.Write(path, sheets.Length > 0 ? sheets : [("stops", Stops), ("depots", Depots), ("vehicles", Vehicles), ("settings", Settings), ("notes", [["anything"]])]);
        return path;
    }

    [Fact]
    public void A_workbook_reads_as_the_same_job_as_its_csv_folder()
    {
        using var folder = new JobFolder(JobFolder.ValidPlanar());
        var csv = CsvJobReader.Read(folder.Path);
        var book = InputLoader.Load(Book());

        Assert.Equal("workbook", book.Format);
        Assert.Equal("north", book.Instance.Name);
        Assert.Equal("sheets stops, depots, vehicles, settings", book.ReadAs);
        var a = book.Instance;
        var b = csv.Instance;
        Assert.Equal(b.DimensionNames, a.DimensionNames);
        Assert.Equal(b.EquipmentNames, a.EquipmentNames);
        for (int i = 0; i < b.Stops.Count; i++)
        {
            Assert.Equal(Facts(b.Stops[i]), Facts(a.Stops[i]));
        }

        for (int i = 0; i < b.Vehicles.Count; i++)
        {
            Assert.Equal(Facts(b.Vehicles[i]), Facts(a.Vehicles[i]));
        }

        Assert.Equal(b.Rules, a.Rules);
        Assert.Equal(b.Objective, a.Objective);
        Assert.Equal(csv.Settings.TimeSeconds, book.Settings.TimeSeconds);
        Assert.Equal(csv.Settings.Solvers!, book.Settings.Solvers!);
        Assert.Equal(csv.Settings.Seed, book.Settings.Seed);
        Assert.Equal(b.Travel.Duration(b.DepotLocation(0), 0), a.Travel.Duration(a.DepotLocation(0), 0), 9); // speed 30 from the sheet

        // The time cells were read as times: 07:30, 26:15 (a [h]:mm cell past midnight) and a duration of 8 hours.
        Assert.Equal((450, 1575, 480), (a.Vehicles[0].ShiftStart, a.Vehicles[0].ShiftEnd, a.Vehicles[0].MaxDuration));
        Assert.Equal(10, a.Stops[0].ServiceTime);
    }

    private static string Facts(Stop s) =>
        FormattableString.Invariant($"{s.Id} {s.X} {s.Y} {string.Join('/', s.Demand)} {s.ServiceTime} {string.Join(';', s.Windows)} {s.Needs} {s.Optional} {s.UnservedPenalty}");

    private static string Facts(Vehicle v) =>
        FormattableString.Invariant($"{v.Id} {v.StartDepot} {string.Join('/', v.Capacity)} {v.ShiftStart} {v.ShiftEnd} {v.MaxDuration} {v.FixedCost} {v.CostPerDistance} {v.CostPerHour} {v.Equipment}");

    [Fact]
    public void Problems_name_the_sheet_row_column_and_cell()
    {
        object?[]?[] stops =
        [
            ["id", "x", "y", "demand_kg", "windows"],
            ["s1", 3, 4, 10, "08:00-10:30"],
            null, // an empty row: the rows below keep their sheet numbers
            ["s2", 6, "north", 20, null],
            ["s3", 0, 10, 5, "10:00-09:00"],
        ];
        object?[]?[] settings = [["key", "value"], ["rules.capacity.hard", "maybe"], ["colour", "red"]];
        var p = Assert.Throws<InputException>(() => InputLoader.Load(Book("bad.xlsx", ("stops", stops), ("depots", Depots), ("vehicles", Vehicles), ("settings", settings)))).Problems;

        var y = Assert.Single(p, x => x.Sheet == "stops" && x.Column == "y");
        Assert.Equal(("bad.xlsx", 4, "north", "C4"), (y.File, y.Row, y.Value, y.Cell));
        Assert.StartsWith("bad.xlsx, sheet 'stops', row 4, column 'y' (cell C4): not a number", y.ToString(), StringComparison.Ordinal);
        Assert.Contains(p, x => x is { Sheet: "stops", Row: 5, Column: "windows", Cell: "E5" });
        Assert.Contains(p, x => x is { Sheet: "settings", Row: 2, Column: "value", Cell: "B2", Value: "\"maybe\"" } && x.Problem.StartsWith("rules.capacity.hard:", StringComparison.Ordinal));
        Assert.Contains(p, x => x is { Sheet: "settings", Row: 3, Column: "key", Cell: "A3" } && x.Fix.Contains("accepted keys", StringComparison.Ordinal));
    }

    [Fact]
    public void A_missing_sheet_is_named_with_the_sheets_the_workbook_has()
    {
        var p = Assert.Throws<InputException>(() => InputLoader.Load(Book("two.xlsx", ("Stop", Stops), ("depots", Depots)))).Problems;

        Assert.Contains(p, x => x.Problem.StartsWith("no sheet named 'stops'", StringComparison.Ordinal) && x.Fix.StartsWith("did you mean 'Stop'?", StringComparison.Ordinal));
        Assert.Contains(p, x => x.Problem.StartsWith("no sheet named 'vehicles'", StringComparison.Ordinal));
    }

    [Fact]
    public void A_file_that_is_no_workbook_gets_a_plain_sentence()
    {
        string path = Path.Combine(Dir, "stops.xlsx");
        File.WriteAllText(path, "id,x,y\n");

        var p = Assert.Single(Assert.Throws<InputException>(() => InputLoader.Load(path)).Problems);
        Assert.Equal("the file is not a readable .xlsx workbook", p.Problem);
    }

    [Fact]
    public void Check_and_solve_take_a_workbook_where_a_job_folder_goes()
    {
        string book = Book();
        var output = new StringWriter();
        Assert.Equal(ExitCodes.Success, CliApp.Run(["check", book], output, new StringWriter()));
        Assert.Contains("valid (workbook, sheets stops, depots, vehicles, settings)", output.ToString(), StringComparison.Ordinal);

        string run = Path.Combine(Dir, "run");
        var err = new StringWriter();
        int code = CliApp.Run(["solve", book, "--solvers", "insertion", "--time", "5", "--out", run, "--quiet"], new StringWriter(), err);
        Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, err.ToString());
        Assert.True(File.Exists(Path.Combine(run, "summary.json")));
        Assert.Contains("\"format\": \"workbook\"", File.ReadAllText(Path.Combine(run, "summary.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void The_worker_solves_a_workbook_dropped_into_its_inbox()
    {
        string inbox = Path.Combine(Dir, "inbox");
        string outbox = Path.Combine(Dir, "outbox");
        Directory.CreateDirectory(inbox);
        File.Move(Book(), Path.Combine(inbox, "north.xlsx"));
        File.SetLastWriteTimeUtc(Path.Combine(inbox, "north.xlsx"), DateTime.UtcNow.AddMinutes(-1)); // settled

        // A real worker process: each job's search runs in a child `anneal run-job`, which the test host cannot be.
        using var worker = WorkerProcess.Start(Dir, "--once", "--time", "1", "--solvers", "insertion");

        Assert.Equal(ExitCodes.Success, worker.WaitForExit());
        Assert.True(File.Exists(Path.Combine(outbox, "north", "summary.json")));
    }
}
