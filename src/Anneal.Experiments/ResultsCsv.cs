using System.Globalization;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using CsvHelper;
using CsvHelper.Configuration;

namespace Anneal.Experiments;

/// <summary>results.csv: one row per finished benchmark run, rewritten atomically as runs finish, and read back to resume.</summary>
public static class ResultsCsv
{
    public static readonly string[] Columns =
    [
        "instance", "solver", "seed", "budget_s", "objective", "objective_value", "vehicles", "distance", "feasible",
        "seconds_to_best", "seconds", "reference", "reference_vehicles", "gap_pct", "trace_file", "lower_bound", "bound_only",
    ];

    /// <summary>Columns added later: a results.csv written before them is still read (the values are then absent).</summary>
    private static readonly string[] Later = ["lower_bound", "bound_only"];

    public static void Write(string path, IEnumerable<BenchRow> rows) => AtomicFile.WriteText(path, writer =>
    {
        using var csv = CsvOutput.Open(writer);
        CsvOutput.Row(csv, Columns);
        foreach (var r in rows)
        {
            CsvOutput.Row(csv,
                r.Instance, r.Solver, I(r.Seed), N(r.BudgetSeconds), r.Objective, N(r.ObjectiveValue), I(r.Vehicles), N(r.Distance),
                r.Feasible ? "true" : "false", N(r.SecondsToBest), N(r.Seconds), N(r.Reference), I(r.ReferenceVehicles), N(r.GapPercent), r.TraceFile,
                N(r.LowerBound), r.BoundOnly ? "true" : "false");
        }
    });

    /// <summary>The rows of a results.csv; an absent file has none.</summary>
    /// <exception cref="InputException">when a column is missing or a value cannot be read (1-based rows, header is row 1).</exception>
    public static IReadOnlyList<BenchRow> Read(string path)
    {
        if (!File.Exists(path))
        {
            return [];
        }

        var rows = new List<BenchRow>();
        var problems = new List<InputProblem>();
        try
        {
            using var reader = new StreamReader(path);
            using var csv = new CsvReader(reader, new CsvConfiguration(CultureInfo.InvariantCulture));
            if (!csv.Read() || !csv.ReadHeader())
            {
                return [];
            }

            foreach (var column in Columns)
            {
                if (!csv.HeaderRecord!.Contains(column, StringComparer.Ordinal) && !Later.Contains(column, StringComparer.Ordinal))
                {
                    problems.Add(new(path, 1, column, null, "a column of results.csv is missing", "let anneal bench write results.csv, or start a new --out folder"));
                }
            }

            if (problems.Count > 0)
            {
                throw new InputException(problems);
            }

            while (csv.Read())
            {
                var cells = new Cells(csv, path, problems);
                var row = new BenchRow(cells.Text("instance"), cells.Text("solver"), (int)cells.Number("seed"), cells.Number("budget_s"), cells.Text("objective"),
                    cells.Number("objective_value"), (int)cells.Number("vehicles"), cells.Number("distance"), cells.Text("feasible") == "true",
                    cells.Number("seconds_to_best"), cells.Number("seconds"), cells.Optional("reference"), (int?)cells.Optional("reference_vehicles"),
                    cells.Optional("gap_pct"), cells.Text("trace_file"), cells.Optional("lower_bound"), cells.Text("bound_only") == "true");
                if (cells.Ok)
                {
                    rows.Add(row);
                }
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or CsvHelperException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "results.csv cannot be read: " + e.Message, "start a new --out folder"));
        }

        if (problems.Count > 0)
        {
            throw new InputException(problems);
        }

        return rows;
    }

    private static string N(double value) => value.ToString("0.######", CultureInfo.InvariantCulture);

    private static string N(double? value) => value is { } v ? N(v) : string.Empty;

    private static string I(int? value) => value is { } v ? v.ToString(CultureInfo.InvariantCulture) : string.Empty;

    /// <summary>Reads the cells of one row, noting each one that is not a number where a number belongs.</summary>
    private sealed class Cells(CsvReader csv, string path, List<InputProblem> problems)
    {
        public bool Ok { get; private set; } = true;

        public string Text(string column) => csv.TryGetField(column, out string? text) ? text ?? string.Empty : string.Empty;

        public double Number(string column) => Optional(column) ?? Fail(column, string.Empty);

        public double? Optional(string column)
        {
            string text = Text(column);
            if (text.Length == 0)
            {
                return null;
            }

            return double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double x) ? x : Fail(column, text);
        }

        private double Fail(string column, string text)
        {
            Ok = false;
            problems.Add(new InputProblem(path, csv.Parser.Row, column, text, "not a number", "repair the row or delete it so that the run is done again"));
            return double.NaN;
        }
    }
}
