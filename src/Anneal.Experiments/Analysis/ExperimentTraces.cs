using Anneal.Reports.Traces;

namespace Anneal.Experiments.Analysis;

/// <summary>
/// Reads back each run's trace (traces/ beside results.csv) with the reference its objective is compared with:
/// the reference file's value where there is one (not under vehicles-then-distance, whose objective prices vehicles
/// and whose references are distances), else the best objective found in the experiment.
/// </summary>
public static class ExperimentTraces
{
    public static IReadOnlyList<TracedRun> Load(string outDir, IReadOnlyList<BenchRow> rows, out int unreadable)
    {
        var best = ExperimentAnalysis.BestFeasible(rows, r => r.ObjectiveValue);
        var runs = new List<TracedRun>();
        unreadable = 0;
        foreach (var row in rows)
        {
            double? reference = row.Reference is { } r && row.Objective != "vehicles-then-distance" ? r
                : best.TryGetValue((row.Instance, row.Objective), out double b) ? b : null;
            string path = Path.Combine(outDir, row.TraceFile);
            if (reference is null || row.TraceFile.Length == 0 || !File.Exists(path))
            {
                unreadable += reference is null ? 0 : 1;
                continue;
            }

            try
            {
                var traces = TraceCsvReader.Read(path);
                var trace = traces.TryGetValue(row.Solver, out var mine) ? mine : traces.Values.FirstOrDefault();
                if (trace is not null)
                {
                    runs.Add(new TracedRun(row, trace, reference.Value));
                }
            }
            catch (Exception e) when (e is IOException or InvalidDataException or CsvHelper.CsvHelperException or FormatException)
            {
                unreadable++;
            }
        }

        return runs;
    }
}
