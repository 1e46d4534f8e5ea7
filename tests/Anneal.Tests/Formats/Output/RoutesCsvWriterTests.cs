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
    public void One_row_per_visit_between_the_depot_departure_and_the_return()
    {
        var lines = Lines(new Plan([new PlannedRoute(0, [0, 1]), new PlannedRoute(1, [2])]));

        Assert.Equal(1 + (2 + 2) + (1 + 2), lines.Length);
        Assert.Equal("vehicle,sequence,kind,stop,name,address,arrival,start,departure,wait,late,window,distance,drive,status,load_kg,load_crates", lines[0]);
        Assert.Equal(["start", "stop", "stop", "end", "start", "stop", "end"], lines.Skip(1).Select(l => l.Split(',')[2]));
    }

    [Fact]
    public void Times_are_clock_times_and_the_window_used_is_named()
    {
        // Hand computation (3-4-5 triangles, 1.5 min per km; departure delayed by the forward time slack, Savelsbergh 1985):
        // A is 7.5 min out (window 09:00-10:00, 10 min service), B 7.5 min beyond A; B's first window 08:00-08:20 cannot be
        // met, its second opens 10:00. The latest start that keeps both on time arrives at A 09:42:30 (shown 09:43),
        // leaves 09:52:30 (09:53) and reaches B exactly at 10:00, so neither waits.
        // Legs: depot to A 5 km (7.5 min), A to B 5 km, B back 10 km (15 min); the van leaves with A's 30 + B's 40 kg.
        var lines = Lines(new Plan([new PlannedRoute(0, [0, 1])]));

        Assert.Equal("van-1,0,start,D,,,,,09:35,,,,0.00,0.00,planned,70,2", lines[1]);
        Assert.Equal("van-1,1,stop,A,,,09:43,09:43,09:53,0.00,0.00,09:00-10:00,5.00,7.50,planned,40,1", lines[2]);
        Assert.Equal("van-1,2,stop,B,,,10:00,10:00,10:05,0.00,0.00,10:00-11:00,5.00,7.50,planned,0,0", lines[3]);
        Assert.Equal("van-1,3,end,D,,,10:20,,,,,,10.00,15.00,planned,0,0", lines[4]);
    }

    [Fact]
    public void Names_and_addresses_travel_into_the_sheet_and_are_quoted_when_they_hold_commas()
    {
        var tiny = TinyJob.Create();
        var stops = tiny.Stops.Select(s => s with { Name = "Corner Shop " + s.Id, Address = "1 Mill Lane, Upper " + s.Id }).ToList();
        var depots = tiny.Depots.Select(d => d with { Name = "Main Yard" }).ToList();
        var instance = new Anneal.Core.Model.Instance(tiny.Name, stops, depots, tiny.Vehicles, tiny.DimensionNames, tiny.EquipmentNames, tiny.Rules, tiny.Objective, tiny.Travel, tiny.Units);
        var writer = new StringWriter();

        RoutesCsvWriter.Write(writer, instance, PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(1, [2])])));

        var lines = writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("van-2,0,start,D,Main Yard,,", lines[1], StringComparison.Ordinal);
        Assert.StartsWith("van-2,1,stop,C,Corner Shop C,\"1 Mill Lane, Upper C\",", lines[2], StringComparison.Ordinal);
    }

    [Fact]
    public void An_always_open_window_reads_any()
    {
        var lines = Lines(new Plan([new PlannedRoute(1, [2])]));

        Assert.EndsWith(",any,5.00,7.50,planned,0,0", lines[2], StringComparison.Ordinal);
    }
}
