using Anneal.Core.Solving;
using MathNet.Numerics.Statistics;

namespace Anneal.Reports.Quality;

/// <summary>
/// Per solver, the median and interquartile range of the gap to the reference over instances and seeds, sampled on a
/// log-spaced time grid. A run counts at a moment once it has a feasible plan; moments where fewer than half of a
/// solver's runs have one are left out, so the median is never taken over a biased few. Quartiles interpolate between
/// order statistics (Hyndman &amp; Fan 1996, definition 7; R's default), MathNet's R7, as the bench summary's do.
/// </summary>
public static class GapCurves
{
    public const int GridPoints = 40;

    public static IReadOnlyDictionary<string, IReadOnlyList<GapPoint>> Compute(IReadOnlyList<BenchRun> runs)
    {
        double first = double.PositiveInfinity, last = 0;
        var bySolver = new SortedDictionary<string, List<BenchRun>>(StringComparer.Ordinal);
        foreach (var run in runs)
        {
            if (!bySolver.TryGetValue(run.Solver, out var list))
            {
                bySolver[run.Solver] = list = [];
            }

            list.Add(run);
            foreach (var p in run.Trace)
            {
                if (p.Seconds > 0)
                {
                    first = Math.Min(first, p.Seconds);
                }

                last = Math.Max(last, p.Seconds);
            }
        }

        var result = new Dictionary<string, IReadOnlyList<GapPoint>>(StringComparer.Ordinal);
        if (!(last > 0))
        {
            return result;
        }

        var grid = Grid(Math.Min(first, last), last);
        foreach (var (solver, list) in bySolver)
        {
            var points = new List<GapPoint>();
            var gaps = new List<double>(list.Count);
            foreach (double t in grid)
            {
                gaps.Clear();
                foreach (var run in list)
                {
                    if (BestAt(run.Trace, t) is { } best && Math.Abs(run.Reference) > 1e-12)
                    {
                        gaps.Add((best - run.Reference) / Math.Abs(run.Reference) * 100);
                    }
                }

                if (gaps.Count * 2 >= list.Count && gaps.Count > 0)
                {
                    var sorted = gaps.ToArray();
                    Array.Sort(sorted);
                    points.Add(new GapPoint(t, Quartile(sorted, 0.5), Quartile(sorted, 0.25), Quartile(sorted, 0.75), gaps.Count));
                }
            }

            result[solver] = points;
        }

        return result;
    }

    /// <summary>Best feasible objective reached by <paramref name="seconds"/>; null before the first feasible plan.</summary>
    public static double? BestAt(IReadOnlyList<TracePoint> trace, double seconds)
    {
        double? best = null;
        foreach (var p in trace)
        {
            if (p.Seconds > seconds + 1e-12)
            {
                break;
            }

            if (p.BestFeasible && double.IsFinite(p.BestObjective))
            {
                best = best is { } b ? Math.Min(b, p.BestObjective) : p.BestObjective;
            }
        }

        return best;
    }

    private static double[] Grid(double from, double to)
    {
        var grid = new double[GridPoints];
        double a = Math.Log10(from), b = Math.Log10(to);
        for (int k = 0; k < GridPoints; k++)
        {
            grid[k] = Math.Pow(10, a + ((b - a) * k / (GridPoints - 1)));
        }

        grid[^1] = to;
        return grid;
    }

    private static double Quartile(double[] sorted, double p) => SortedArrayStatistics.QuantileCustom(sorted, p, QuantileDefinition.R7);
}
