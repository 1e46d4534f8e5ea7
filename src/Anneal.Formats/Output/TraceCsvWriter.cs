using System.Globalization;
using Anneal.Core.Solving;

namespace Anneal.Formats.Output;

/// <summary>trace.csv: every solver's convergence samples, for plots and for comparing strategies.</summary>
public static class TraceCsvWriter
{
    public const string FileName = "trace.csv";

    /// <summary>Every solver's trace points, solver by solver.</summary>
    public static IEnumerable<(string Solver, TracePoint Point)> Rows(RunOutcome outcome)
    {
        foreach (var judged in outcome.Results)
        {
            foreach (var p in judged.Result.Trace)
            {
                yield return (judged.Result.Solver, p);
            }
        }
    }

    /// <summary>One solver's trace.</summary>
    public static IEnumerable<(string Solver, TracePoint Point)> Rows(string solver, IEnumerable<TracePoint> trace)
    {
        foreach (var p in trace)
        {
            yield return (solver, p);
        }
    }

    public static void Write(string path, IEnumerable<(string Solver, TracePoint Point)> rows) =>
        AtomicFile.WriteText(path, writer => Write(writer, rows));

    public static void Write(TextWriter writer, IEnumerable<(string Solver, TracePoint Point)> rows)
    {
        using var csv = CsvOutput.Open(writer);
        foreach (var name in new[] { "solver", "seconds", "iteration", "best_objective", "current_objective", "best_feasible", "state" })
        {
            csv.WriteField(name);
        }

        csv.NextRecord();
        foreach (var (solver, row) in rows)
        {
            csv.WriteField(solver);
            csv.WriteField(row.Seconds.ToString("0.000", CultureInfo.InvariantCulture));
            csv.WriteField(row.Iteration.ToString(CultureInfo.InvariantCulture));
            csv.WriteField(Objective(row.BestObjective));
            csv.WriteField(Objective(row.CurrentObjective));
            csv.WriteField(row.BestFeasible ? "true" : "false");
            csv.WriteField(row.State);
            csv.NextRecord();
        }

        csv.Flush();
    }

    // "R" keeps full precision so small improvements late in a run stay visible in the trace.
    private static string Objective(double value) => double.IsFinite(value) ? value.ToString("R", CultureInfo.InvariantCulture) : string.Empty;
}
