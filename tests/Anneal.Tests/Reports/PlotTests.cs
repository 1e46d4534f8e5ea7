using Anneal.Reports.Plots;
using Anneal.Reports.Quality;
using Anneal.Core.Solving;

namespace Anneal.Tests.Reports;

public sealed class PlotTests
{
    public static TheoryData<string> Cases => new() { "demo", "large" };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Each_plot_is_a_png_of_the_expected_size_and_not_blank(string which)
    {
        var (instance, plan) = which == "demo" ? ReportFixtures.DemoPlan() : ReportFixtures.Large();
        Assert.True(plan.VehiclesUsed > 0);

        PngCheck.Valid(PlotFile.Png(RouteMap.Create(instance, plan), RouteMap.Size), 1000, 800);
        var size = ScheduleChart.SizeFor(plan);
        PngCheck.Valid(PlotFile.Png(ScheduleChart.Create(instance, plan), size), (int)size.Width, (int)size.Height);
        PngCheck.Valid(PlotFile.Png(ConvergencePlot.Create(ReportFixtures.Solvers(plan.Objective)), ConvergencePlot.Size), 1000, 560);
    }

    [Fact]
    public void Saving_the_svg_keeps_the_line_patterns_of_the_png()
    {
        // The SVG is drawn with solid lines (Skia's SVG canvas cannot write a dash effect); the patterns must be back
        // afterwards, so a picture drawn after the save still shows route 13 dashed.
        var plot = new ScottPlot.Plot();
        var dashed = plot.Add.Scatter(new double[] { 0, 1, 2 }, new double[] { 0, 1, 0 });
        dashed.LinePattern = ScottPlot.LinePattern.Dashed;
        string folder = Directory.CreateTempSubdirectory("anneal-plot-").FullName;
        try
        {
            byte[] saved = PlotFile.Save(plot, folder, "dashed", new ScottPlot.PixelSize(300, 200));

            Assert.Equal(ScottPlot.LinePattern.Dashed, dashed.LinePattern);
            Assert.Equal(saved, PlotFile.Png(plot, new ScottPlot.PixelSize(300, 200)));
            Assert.Contains("<svg", File.ReadAllText(Path.Combine(folder, "dashed.svg")), StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void The_quality_plot_draws_median_and_band_per_solver()
    {
        var runs = new List<BenchRun>();
        foreach (var solver in new[] { "sa", "tabu" })
        {
            for (int seed = 1; seed <= 3; seed++)
            {
                double reference = 100 * seed;
                runs.Add(new BenchRun("i" + seed, solver, seed,
                    [new TracePoint(0.01, 1, reference * 1.3, 0, true, string.Empty), new TracePoint(1, 9, reference * (solver == "sa" ? 1.05 : 1.02), 0, true, string.Empty)],
                    reference));
            }
        }

        PngCheck.Valid(PlotFile.Png(QualityPlot.Create(runs), QualityPlot.Size), 1000, 560);
        var curves = GapCurves.Compute(runs);
        Assert.Equal(2, curves.Count);
        Assert.Equal(2.0, curves["tabu"][^1].Median, 6); // every tabu run ends 2% above its reference
        Assert.Equal(30.0, curves["sa"][0].Median, 6);
    }

    [Fact]
    public void The_quality_band_follows_the_interpolating_quantile_definition()
    {
        // Hyndman & Fan (1996) definition 7, R's default: quantile(c(1,2,3,4), c(.25,.5,.75)) = 1.75, 2.5, 3.25.
        // Four runs end 4%, 1%, 3% and 2% above their reference.
        var runs = new List<BenchRun>();
        double[] ends = [104, 101, 103, 102];
        for (int k = 0; k < ends.Length; k++)
        {
            runs.Add(new BenchRun("i" + k, "sa", 1, [new TracePoint(0.01, 1, 130, 0, true, string.Empty), new TracePoint(1, 9, ends[k], 0, true, string.Empty)], 100));
        }

        var last = GapCurves.Compute(runs)["sa"][^1];
        Assert.Equal(1.75, last.Lower, 9);
        Assert.Equal(2.5, last.Median, 9);
        Assert.Equal(3.25, last.Upper, 9);
    }
}
