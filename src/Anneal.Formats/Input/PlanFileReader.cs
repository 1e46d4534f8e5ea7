using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Replanning;
using Anneal.Formats.Input.Csv;
using Anneal.Formats.Output;

namespace Anneal.Formats.Input;

/// <summary>
/// Reads the plan a re-plan starts from (`solve --from`): a routes.csv of an earlier run, possibly edited by hand.
/// Each vehicle's visits are taken in the order of the file's rows (the `sequence` column is not needed after rows
/// are moved). A stop the job no longer has is cancelled; an unknown vehicle, a stop listed twice or a bad time,
/// status or pin is an error naming the row and column.
/// </summary>
public static class PlanFileReader
{
    /// <summary>Columns read besides the routes.csv columns that are only carried along (names, legs, loads).</summary>
    public static IReadOnlyList<string> ReadColumns { get; } = ["vehicle", "kind", "stop", "start", "departure", "arrival", "status", "pinned"];

    private static readonly string[] Accepted = [.. RoutesCsvWriter.Columns, "status", "pinned"];

    /// <exception cref="InputException">with every problem found.</exception>
    public static GivenPlan Read(string path, Instance day)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new InputException([new InputProblem(path, null, null, null, "the plan file cannot be read: " + FileTrouble.Reading(path, e),
                "give --from the path of a routes.csv written by an earlier run")]);
        }

        return Parse(CsvText.Decode(bytes, out _), path, day);
    }

    /// <exception cref="InputException">with every problem found.</exception>
    public static GivenPlan Parse(string text, string file, Instance day)
    {
        var problems = new ProblemList();
        var table = CsvTable.Parse(text, file, problems);
        if (table is null)
        {
            problems.Add(file, null, null, null, "the plan file is empty", "give --from a routes.csv with a header line and one row per visit");
            problems.ThrowIfAny();
            return new GivenPlan(file, []);
        }

        foreach (var column in table.Header)
        {
            if (!column.StartsWith("note", StringComparison.OrdinalIgnoreCase) && !column.StartsWith("load_", StringComparison.OrdinalIgnoreCase)
                && !Accepted.Contains(column, StringComparer.OrdinalIgnoreCase))
            {
                problems.Add(table, 1, column, null, "unknown column in the plan file", "use the columns of routes.csv (" + string.Join(", ", Accepted) + "), or start the column's name with 'note'");
            }
        }

        foreach (var required in new[] { "vehicle", "stop" })
        {
            if (!table.Has(required))
            {
                problems.Add(table, 1, required, null, $"the plan file has no '{required}' column", "give --from a routes.csv written by an earlier run");
            }
        }

        problems.ThrowIfAny();
        var stopIndex = Index(day.Stops.Select(s => s.Id));
        var vehicleIndex = Index(day.Vehicles.Select(v => v.Id));
        var depotIds = new HashSet<string>(day.Depots.Select(d => d.Id), StringComparer.Ordinal);
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        var visits = new Dictionary<int, List<GivenVisit>>();
        var departures = new Dictionary<int, double>();
        var returns = new Dictionary<int, double>();
        var order = new List<int>();
        foreach (var row in table.Rows)
        {
            string Cell(string column) => table.IndexOf(column) is int i && i >= 0 && i < row.Cells.Length ? row.Cells[i].Trim() : string.Empty;
            if (row.Cells.All(string.IsNullOrWhiteSpace))
            {
                continue;
            }

            string vehicleId = Cell("vehicle");
            if (!vehicleIndex.TryGetValue(vehicleId, out int vehicle))
            {
                var near = Closest.Find(vehicleId, day.Vehicles.Select(v => v.Id).ToList());
                problems.Add(table, row.Line, "vehicle", vehicleId, "no such vehicle in the job's vehicles",
                    (near is not null ? $"did you mean '{near}'? " : string.Empty) + "use a vehicle id of vehicles.csv (a type with count 3 is id-1 ... id-3); to take a vehicle out use --without or available_until");
                continue;
            }

            if (!visits.TryGetValue(vehicle, out var list))
            {
                list = [];
                visits[vehicle] = list;
                order.Add(vehicle);
            }

            string kind = table.Has("kind") ? Cell("kind").ToLowerInvariant() : "stop";
            string stopId = Cell("stop");
            if (kind is "start" or "end")
            {
                if (!depotIds.Contains(stopId) && !stopIndex.ContainsKey(stopId))
                {
                    problems.Add(table, row.Line, "stop", stopId, $"the {kind} row names no depot of the job", "give the depot id of depots.csv, or delete the row");
                }

                var column = kind == "start" ? "departure" : "arrival";
                if (Time(table, row.Line, column, Cell(column), day, problems) is double t)
                {
                    (kind == "start" ? departures : returns)[vehicle] = t;
                }

                continue;
            }

            // A driver's break is planned afresh by the evaluator of the re-plan.
            if (kind == "break")
            {
                continue;
            }

            if (kind != "stop")
            {
                problems.Add(table, row.Line, "kind", kind, "unknown kind of row", "write start, stop, break or end");
                continue;
            }

            if (stopId.Length == 0)
            {
                problems.Add(table, row.Line, "stop", null, "the row names no stop", "give the stop's id, or delete the row");
                continue;
            }

            if (seen.TryGetValue(stopId, out int first))
            {
                problems.Add(table, row.Line, "stop", stopId, $"the stop is listed twice (first on row {first})", "keep one of the two rows");
                continue;
            }

            seen[stopId] = row.Line;
            if (depotIds.Contains(stopId) && !stopIndex.ContainsKey(stopId))
            {
                problems.Add(table, row.Line, "stop", stopId, "a depot on a stop row", "write kind start or end on depot rows, or give a stop id");
                continue;
            }

            int stop = stopIndex.TryGetValue(stopId, out int s) ? s : -1;
            var start = Time(table, row.Line, "start", Cell("start"), day, problems);
            var departure = Time(table, row.Line, "departure", Cell("departure"), day, problems);
            list.Add(new GivenVisit(row.Line, stopId, stop, start, departure, Status(table, row.Line, Cell("status"), problems), Pinned(table, row.Line, Cell("pinned"), problems)));
        }

        problems.ThrowIfAny();
        var routes = order.Select(v => new GivenRoute(v, visits[v], departures.TryGetValue(v, out var d) ? d : null, returns.TryGetValue(v, out var r) ? r : null)).ToList();
        return new GivenPlan(file, routes);
    }

    private static Dictionary<string, int> Index(IEnumerable<string> ids)
    {
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        int i = 0;
        foreach (var id in ids)
        {
            index.TryAdd(id, i++);
        }

        return index;
    }

    private static double? Time(CsvTable table, int line, string column, string text, Instance day, ProblemList problems)
    {
        if (text.Length == 0)
        {
            return null;
        }

        bool ok = day.Units.Clock
            ? Csv.TimeText.TryParseTime(text, out double minutes)
            : double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out minutes) && double.IsFinite(minutes);
        if (!ok)
        {
            problems.Add(table, line, column, text, "not a time", day.Units.Clock ? "write HH:MM (up to 47:59), or leave it empty" : "write a number, or leave it empty");
            return null;
        }

        return minutes;
    }

    private static VisitStatus? Status(CsvTable table, int line, string text, ProblemList problems)
    {
        switch (text.ToLowerInvariant())
        {
            case "":
                return null;
            case "done":
                return VisitStatus.Done;
            case "in-progress":
                return VisitStatus.InProgress;
            case "planned":
                return VisitStatus.Planned;
            default:
                problems.Add(table, line, "status", text, "unknown status", "write done, in-progress or planned, or leave it empty (then the start time and --now decide)");
                return null;
        }
    }

    private static bool Pinned(CsvTable table, int line, string text, ProblemList problems)
    {
        switch (text.ToLowerInvariant())
        {
            case "" or "no" or "false" or "0":
                return false;
            case "yes" or "true" or "1" or "vehicle":
                return true;
            default:
                problems.Add(table, line, "pinned", text, "not yes or no", "write yes (the stop stays on its vehicle) or no, or leave it empty");
                return false;
        }
    }
}
