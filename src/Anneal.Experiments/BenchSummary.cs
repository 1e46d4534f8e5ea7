using System.Globalization;

namespace Anneal.Experiments;

/// <summary>The headline numbers of a benchmark: per solver, and the better solver per instance.</summary>
public static class BenchSummary
{
    public static IReadOnlyList<string> Lines(IReadOnlyList<BenchRow> rows)
    {
        var lines = new List<string>();
        var solvers = rows.Select(r => r.Solver).Distinct().ToList();
        foreach (var solver in solvers)
        {
            var mine = rows.Where(r => r.Solver == solver).ToList();
            var gaps = mine.Where(r => r.GapPercent is not null).Select(r => r.GapPercent!.Value).ToList();
            lines.Add(string.Create(CultureInfo.InvariantCulture,
                $"{solver,-10} runs {mine.Count,3}  feasible {mine.Count(r => r.Feasible),3}  vehicles {mine.Sum(r => r.Vehicles) / (double)Math.Max(1, SeedCount(mine)),7:0.#} (total per seed)  mean gap {(gaps.Count > 0 ? gaps.Average().ToString("0.00", CultureInfo.InvariantCulture) + "%" : "n/a"),8}"));
        }

        if (solvers.Count > 1)
        {
            // Per instance: each solver's mean gap over seeds; the better solver's; then the mean over instances.
            var perInstance = rows.Where(r => r.GapPercent is not null).GroupBy(r => r.Instance)
                .Select(g => g.GroupBy(r => r.Solver).Min(s => s.Average(r => r.GapPercent!.Value))).ToList();
            if (perInstance.Count > 0)
            {
                lines.Add(string.Create(CultureInfo.InvariantCulture, $"better solver per instance: mean gap {perInstance.Average():0.00}% over {perInstance.Count} instances"));
            }
        }

        return lines;
    }

    private static int SeedCount(List<BenchRow> rows) => rows.Select(r => r.Seed).Distinct().Count();
}
