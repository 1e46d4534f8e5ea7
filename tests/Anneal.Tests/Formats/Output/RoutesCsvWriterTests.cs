using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Output;

namespace Anneal.Tests.Formats.Output;

public sealed class RoutesCsvWriterTests
{
    private static string[] Lines(Plan plan)
    {
        var instance = TinyJob.Create();
        var writer = new StringWriter();
        RoutesCsvWriter.Write(writer, instance, PlanEvaluator.Evaluate(instance, plan));
        return writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
    }

    [Fact]
    public void One_row_per_visit_after_the_header()
    {
        var lines = Lines(new Plan([new PlannedRoute(0, [0, 1]), new PlannedRoute(1, [2])]));

        Assert.Equal(1 + 3, lines.Length);
        Assert.Equal("vehicle,sequence,stop,arrival,start,departure,wait,late,window,load_kg,load_crates", lines[0]);
    }

    [Fact]
    public void Times_are_clock_times_and_the_window_used_is_named()
    {
        // Hand computation (3-4-5 triangles, 1.5 min per km; departure delayed by the forward time slack, Savelsbergh 1985):
        // A is 7.5 min out (window 09:00-10:00, 10 min service), B 7.5 min beyond A; B's first window 08:00-08:20 cannot be
        // met, its second opens 10:00. The latest start that keeps both on time arrives at A 09:42:30 (shown 09:43),
        // leaves 09:52:30 (09:53) and reaches B exactly at 10:00, so neither waits.
        var lines = Lines(new Plan([new PlannedRoute(0, [0, 1])]));

        Assert.Equal("van-1,1,A,09:43,09:43,09:53,0.00,0.00,09:00-10:00,40,1", lines[1]);
        Assert.Equal("van-1,2,B,10:00,10:00,10:05,0.00,0.00,10:00-11:00,0,0", lines[2]);
    }

    [Fact]
    public void An_always_open_window_reads_any()
    {
        var lines = Lines(new Plan([new PlannedRoute(1, [2])]));

        Assert.EndsWith(",any,0,0", lines[1], StringComparison.Ordinal);
    }
}
