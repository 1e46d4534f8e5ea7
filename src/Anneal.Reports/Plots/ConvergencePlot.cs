using System.Globalization;
using Anneal.Reports.Traces;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>
/// Best objective against elapsed seconds (log axis), one line per solver: dotted while the best plan still breaks a
/// hard rule, solid once feasible, a ring where it first became feasible; the strongest proven lower bound as a
/// dashed line (a solver that only proves bounds draws its bound rising over time) and a note of the gap between the
/// best plan and that bound. When values far above the best would squash it flat, the axis stops at
/// <see cref="Focus"/> above the best and the note says what lies beyond.
/// </summary>
public static class ConvergencePlot
{
    public const string FileStem = "convergence";
    public static readonly PixelSize Size = new(1000, 560);

    // Times at or below zero cannot sit on a log axis; the first samples are drawn at this many seconds.
    private const double EarliestSeconds = 0.001;

    /// <summary>The axis shows at most this fraction above the best plan's objective (the last quarter is where solvers differ).</summary>
    public const double Focus = 0.25;

    /// <param name="chosen">The solver whose plan was written, named in the note; null to name the best line.</param>
    public static Plot Create(IReadOnlyList<SolverRun> solvers, string? chosen = null)
    {
        var plot = new Plot();
        plot.Title("Best plan found so far");
        plot.XLabel("elapsed seconds (log scale)");
        plot.YLabel("objective");
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity, bestFinal = double.PositiveInfinity;
        for (int k = 0; k < solvers.Count; k++)
        {
            var s = solvers[k];
            var color = Palette.Solver(k);
            var (xs, ys, feasibleFrom) = Steps(s);
            if (xs.Length == 0)
            {
                continue;
            }

            if (s.BoundOnly)
            {
                var rising = plot.Add.ScatterLine(xs, ys, Palette.Bound);
                rising.LinePattern = LinePattern.Dashed;
                rising.LineWidth = 1.5f;
                rising.ConnectStyle = ConnectStyle.StepHorizontal;
                rising.LegendText = $"lower bound ({s.Solver})";
                lo = Math.Min(lo, ys[^1]);
                continue;
            }

            if (feasibleFrom > 0)
            {
                var early = plot.Add.ScatterLine(xs[..(Math.Min(feasibleFrom + 1, xs.Length))], ys[..(Math.Min(feasibleFrom + 1, ys.Length))], color);
                early.LinePattern = LinePattern.Dotted;
                early.LineWidth = 2;
                early.ConnectStyle = ConnectStyle.StepHorizontal;
            }

            if (feasibleFrom < xs.Length)
            {
                var line = plot.Add.ScatterLine(xs[feasibleFrom..], ys[feasibleFrom..], color);
                line.LineWidth = 2.5f;
                line.ConnectStyle = ConnectStyle.StepHorizontal;
                line.LegendText = s.Solver;
                var ring = plot.Add.Marker(xs[feasibleFrom], ys[feasibleFrom], MarkerShape.OpenCircle, 11, color);
                ring.MarkerLineWidth = 2;
                hi = Math.Max(hi, ys[feasibleFrom]);
            }
            else
            {
                plot.Add.Marker(xs[^1], ys[^1], MarkerShape.Eks, 10, color).LegendText = s.Solver + " (never feasible)";
                hi = Math.Max(hi, ys[0]);
            }

            lo = Math.Min(lo, ys[^1]);
            bestFinal = Math.Min(bestFinal, ys[^1]);
        }

        var bound = Bound(solvers);
        if (bound is { } b && !DrawnRising(solvers, b.Value))
        {
            var line = plot.Add.HorizontalLine(b.Value, 1.5f, Palette.Bound, LinePattern.Dashed);
            line.LegendText = $"lower bound ({b.Solver})";
            lo = Math.Min(lo, b.Value);
        }

        string? cut = null;
        if (double.IsFinite(bestFinal) && double.IsFinite(hi) && hi > bestFinal + (Math.Abs(bestFinal) * Focus) && Math.Abs(bestFinal) > 1e-9)
        {
            double top = bestFinal + (Math.Abs(bestFinal) * Focus);
            cut = Cut(solvers, top);
            hi = top;
        }

        var note = plot.Add.Annotation(Note(solvers, bound, chosen) + (cut is null ? string.Empty : "\n" + cut), Alignment.UpperRight);
        note.LabelStyle.BackgroundColor = Colors.White;
        note.LabelStyle.BorderColor = Colors.Gray;
        note.LabelStyle.ShadowColor = Colors.Transparent;
        note.LabelStyle.FontSize = 13;
        plot.Axes.Bottom.TickGenerator = LogSecondsTicks.Create();
        if (double.IsFinite(lo) && double.IsFinite(hi))
        {
            double pad = Math.Max((hi - lo) * 0.08, Math.Max(Math.Abs(lo) * 0.002, 1e-6));
            plot.Axes.SetLimitsY(lo - pad, hi + ((cut is null ? 3 : 1) * pad));
        }

        plot.Legend.Alignment = Alignment.LowerLeft;
        plot.ShowLegend();
        return plot;
    }

    /// <summary>Trace as step points on log10 seconds, extended to the solver's end; index of the first feasible point.</summary>
    private static (double[] Xs, double[] Ys, int FeasibleFrom) Steps(SolverRun s)
    {
        var xs = new List<double>();
        var ys = new List<double>();
        int feasibleFrom = -1;
        foreach (var p in s.Trace)
        {
            if (!double.IsFinite(p.BestObjective))
            {
                continue;
            }

            if (feasibleFrom < 0 && p.BestFeasible)
            {
                feasibleFrom = xs.Count;
            }

            xs.Add(Math.Log10(Math.Max(p.Seconds, EarliestSeconds)));
            ys.Add(p.BestObjective);
        }

        if (xs.Count > 0 && s.Seconds > 0 && Math.Log10(Math.Max(s.Seconds, EarliestSeconds)) > xs[^1])
        {
            xs.Add(Math.Log10(Math.Max(s.Seconds, EarliestSeconds)));
            ys.Add(ys[^1]);
        }

        return (xs.ToArray(), ys.ToArray(), feasibleFrom < 0 ? xs.Count : feasibleFrom);
    }

    /// <summary>A bound-only solver's rising line already ends at (or above) this bound: no second dashed line for it.</summary>
    private static bool DrawnRising(IReadOnlyList<SolverRun> solvers, double bound)
    {
        foreach (var s in solvers)
        {
            if (s.BoundOnly && s.LowerBound is { } own && own >= bound)
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>The strongest (highest) lower bound any solver proved.</summary>
    public static (string Solver, double Value)? Bound(IReadOnlyList<SolverRun> solvers)
    {
        (string, double)? best = null;
        foreach (var s in solvers)
        {
            if (s.LowerBound is { } b && double.IsFinite(b) && (best is null || b > best.Value.Item2))
            {
                best = (s.Solver, b);
            }
        }

        return best;
    }

    /// <summary>What the focused axis leaves out: every solver whose final plan lies above it, and the early values.</summary>
    private static string Cut(IReadOnlyList<SolverRun> solvers, double top)
    {
        var above = new List<string>();
        foreach (var s in solvers)
        {
            if (s.Objective is { } o && o > top)
            {
                above.Add(string.Create(CultureInfo.InvariantCulture, $"{s.Solver} {o:#,0.##}"));
            }
        }

        string what = above.Count == 0 ? "earlier values" : "earlier values and the final plans of " + string.Join(", ", above);
        return string.Create(CultureInfo.InvariantCulture, $"axis cut at {top:#,0.##} ({Focus:P0} above the best):\n{what} lie above");
    }

    private static string Note(IReadOnlyList<SolverRun> solvers, (string Solver, double Value)? bound, string? chosen)
    {
        SolverRun? best = null;
        foreach (var s in solvers)
        {
            if (s.BoundOnly || s.Objective is null)
            {
                continue;
            }

            if (chosen is not null ? s.Solver == chosen : best is null || (s.Feasible && !best.Feasible) || (s.Feasible == best.Feasible && s.Objective < best.Objective))
            {
                best = s;
            }
        }

        if (best?.Objective is not { } objective)
        {
            return "no solver found a plan";
        }

        string head = string.Create(CultureInfo.InvariantCulture, $"{(chosen is null ? "best" : "chosen")} {objective:#,0.##} ({best.Solver}{(best.Feasible ? string.Empty : ", infeasible")})");
        if (bound is not { } b)
        {
            return head + "\nno lower bound proved: the gap to optimal is unknown";
        }

        double? gap = TraceFacts.GapPercent(objective, b.Value);
        return head + string.Create(CultureInfo.InvariantCulture, $"\nlower bound {b.Value:#,0.##} ({b.Solver})\ngap at most {gap:0.0#}%");
    }
}
