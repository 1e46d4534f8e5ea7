using System.Globalization;
using Anneal.Formats.Output;

namespace Anneal.Experiments;

/// <summary>results.csv: one row per benchmark run, rewritten atomically as runs finish.</summary>
public static class ResultsCsv
{
    public static readonly string[] Columns =
    [
        "instance", "solver", "seed", "budget_s", "objective", "objective_value", "vehicles", "distance", "feasible",
        "seconds_to_best", "seconds", "reference", "reference_vehicles", "gap_pct", "trace_file",
    ];

    public static void Write(string path, IEnumerable<BenchRow> rows) => AtomicFile.WriteText(path, writer =>
    {
        writer.WriteLine(string.Join(',', Columns));
        foreach (var r in rows)
        {
            writer.WriteLine(string.Join(',',
                Quote(r.Instance), Quote(r.Solver), I(r.Seed), N(r.BudgetSeconds), r.Objective, N(r.ObjectiveValue), I(r.Vehicles), N(r.Distance),
                r.Feasible ? "true" : "false", N(r.SecondsToBest), N(r.Seconds), N(r.Reference), I(r.ReferenceVehicles), N(r.GapPercent), Quote(r.TraceFile)));
        }
    });

    private static string N(double value) => value.ToString("0.######", CultureInfo.InvariantCulture);

    private static string N(double? value) => value is { } v ? N(v) : string.Empty;

    private static string I(int? value) => value is { } v ? v.ToString(CultureInfo.InvariantCulture) : string.Empty;

    private static string Quote(string text) => text.Contains(',') || text.Contains('"') ? "\"" + text.Replace("\"", "\"\"") + "\"" : text;
}
