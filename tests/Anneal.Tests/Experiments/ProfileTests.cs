using Anneal.Experiments;
using Anneal.Experiments.Analysis;
using static Anneal.Tests.Experiments.ExperimentRows;

namespace Anneal.Tests.Experiments;

public sealed class ProfileTests
{
    // Three instances, two solvers, one seed; on I2 solver a breaks a hard rule.
    private static readonly BenchRow[] Table =
    [
        Row("I1", "a", 100), Row("I1", "b", 110),
        Row("I2", "a", 150, feasible: false), Row("I2", "b", 180),
        Row("I3", "a", 50), Row("I3", "b", 50),
    ];

    [Fact]
    public void Ratios_are_to_the_best_feasible_run_and_infeasible_runs_never_count()
    {
        // Dolan & Moré (2002), eq. (1)-(2): r = t / min t over solvers; ρ(τ) = share of problems with r ≤ τ; a failed run has r = ∞ (r_M).
        var profile = PerformanceProfile.Compute(Table);
        var a = profile.Single(p => p.Solver == "a");
        var b = profile.Single(p => p.Solver == "b");
        Assert.Equal([1.0, 1.0, double.PositiveInfinity], a.Ratios);
        Assert.Equal([1.0, 1.0, 1.1], b.Ratios.Select(r => Math.Round(r, 12)));
        Assert.Equal(2 / 3.0, a.Rho(1), 12);
        Assert.Equal(2 / 3.0, a.Rho(100), 12);
        Assert.Equal(2 / 3.0, b.Rho(1.05), 12);
        Assert.Equal(1.0, b.Rho(1.1), 12);
    }

    [Fact]
    public void Without_references_gaps_are_to_the_experiment_best_and_best_counts_share_ties()
    {
        var stats = ExperimentAnalysis.Compute(Table);
        Assert.Equal(["I1 (distance)", "I2 (distance)", "I3 (distance)"], stats.WithoutReference);
        var a = stats.Configs.Single(c => c.Solver == "a");
        var b = stats.Configs.Single(c => c.Solver == "b");
        Assert.Equal((3, 2), (a.Runs, a.Feasible));
        Assert.Equal([0.0, 0.0], stats.Gaps.Where(g => g.Row.Solver == "a" && g.Gap is not null).Select(g => g.Gap!.Value));
        Assert.Equal(10.0, stats.Gaps.Single(g => g.Row.Solver == "b" && g.Row.Instance == "I1").Gap!.Value, 9);
        Assert.Null(stats.Gaps.Single(g => g.Row.Solver == "a" && g.Row.Instance == "I2").Gap);
        Assert.Equal(2, a.BestCount); // I1 and the tie on I3
        Assert.Equal(2, b.BestCount); // I2 (a infeasible) and the tie on I3
        var pair = Assert.Single(stats.Pairs);
        Assert.Equal(2, pair.Test.Pairs + pair.Test.Zeros); // I2 is left out: a has no feasible run there
    }

    [Fact]
    public void Reference_values_are_used_where_results_have_them()
    {
        BenchRow[] rows = [Row("I1", "a", 105, reference: 100), Row("I1", "b", 102, reference: 100), Row("I2", "a", 10), Row("I2", "b", 12)];
        var stats = ExperimentAnalysis.Compute(rows);
        Assert.Equal(["I2 (distance)"], stats.WithoutReference);
        var gaps = stats.Gaps.ToDictionary(g => (g.Row.Instance, g.Row.Solver));
        Assert.True(gaps[("I1", "a")].FromReference);
        Assert.Equal(5.0, gaps[("I1", "a")].Gap!.Value, 9);
        Assert.False(gaps[("I2", "b")].FromReference);
        Assert.Equal(20.0, gaps[("I2", "b")].Gap!.Value, 9);
        // Per solver: median of a's gaps {5, 0} is 2.5.
        Assert.Equal(2.5, stats.Configs.Single(c => c.Solver == "a").Gap.Median, 9);
    }

    [Fact]
    public void Time_to_target_counts_runs_that_never_reach_it()
    {
        var trace = new List<Anneal.Core.Solving.TracePoint>
        {
            new(0.1, 1, 110, 110, true, ""), new(0.5, 2, 101.5, 101.5, true, ""), new(2.0, 3, 100.5, 100.5, true, ""),
        };
        var never = new List<Anneal.Core.Solving.TracePoint> { new(0.1, 1, 120, 120, true, "") };
        TracedRun[] runs = [new(Row("I1", "a", 100.5), trace, 100), new(Row("I2", "a", 120), never, 100)];
        var series = TimeToTarget.Compute(runs, [1, 2]);
        var within1 = series.Single(s => s.Percent == 1);
        var within2 = series.Single(s => s.Percent == 2);
        Assert.Equal([2.0], within1.Seconds);
        Assert.Equal([0.5], within2.Seconds);
        Assert.Equal(0.5, within2.FractionBy(1), 12);
        Assert.Equal(0, within2.FractionBy(0.4), 12);
    }
}
