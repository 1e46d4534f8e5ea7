using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.Csv;

public class CsvJobReaderTests
{
    [Fact]
    public void Valid_job_loads_dimensions_equipment_vehicles_windows_and_rules()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar(), "small-job");
        var loaded = CsvJobReader.Read(job.Path);
        var inst = loaded.Instance;

        Assert.Equal("csv-job", loaded.Format);
        Assert.Equal("small-job", inst.Name);
        Assert.Equal(Units.Minutes, inst.Units);
        Assert.Equal(["kg", "m3"], inst.DimensionNames);
        Assert.Equal(["cold", "lift"], inst.EquipmentNames); // vehicles' spelling and order; the stop's "Cold" matches case-insensitively
        Assert.Equal(["van-1", "van-2", "fridge"], inst.Vehicles.Select(v => v.Id));

        var van = inst.Vehicles[0];
        Assert.Equal(7 * 60 + 30, van.ShiftStart);
        Assert.Equal(26 * 60 + 15, van.ShiftEnd);
        Assert.Equal(480, van.MaxDuration);
        Assert.Equal(50, van.FixedCost);
        Assert.Equal(0.4, van.CostPerDistance);
        Assert.Equal(22, van.CostPerHour);
        Assert.Equal(0UL, van.Equipment);
        Assert.Equal(3UL, inst.Vehicles[2].Equipment);
        Assert.True(double.IsPositiveInfinity(inst.Vehicles[2].MaxDuration));
        Assert.NotSame(inst.Vehicles[0].Capacity, inst.Vehicles[1].Capacity);

        var s1 = inst.Stops[0];
        Assert.Equal([new TimeWindow(480, 630), new TimeWindow(840, 960)], s1.Windows);
        Assert.Equal(10, s1.ServiceTime);
        Assert.Equal([10, 1.5], s1.Demand);
        Assert.False(s1.Optional);
        Assert.True(double.IsNaN(s1.UnservedPenalty));
        var s2 = inst.Stops[1];
        Assert.Equal([20, 0], s2.Demand);
        Assert.True(s2.Optional);
        Assert.Equal(90, s2.UnservedPenalty);
        Assert.Equal(1UL, s2.Needs);
        Assert.Equal([TimeWindow.Always], inst.Stops[2].Windows);

        Assert.Equal(Objective.Distance, inst.Objective);
        Assert.Equal(Objective.Distance, loaded.Settings.Objective);
        Assert.Equal(12, loaded.Settings.TimeSeconds);
        Assert.Equal(["sa", "tabu"], loaded.Settings.Solvers!);
        Assert.Equal(7, loaded.Settings.Seed);
        Assert.Equal(Rule.Soft(2.5), inst.Rules.TimeWindows);
        Assert.Equal(Rule.Soft(250), inst.Rules.Unserved);
        Assert.True(inst.Rules.Capacity.Hard);

        // Depot after the stops; (0,0)-(3,4) is the 3-4-5 right triangle: 5 km, at 30 km/h 10 minutes.
        Assert.Equal(5, inst.Travel.Distance(inst.DepotLocation(0), 0), 9);
        Assert.Equal(10, inst.Travel.Duration(inst.DepotLocation(0), 0), 9);
    }

    [Fact]
    public void Broken_job_lists_every_problem_with_file_row_and_column()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] =
            "id,x,y,demand_kg,service,windows,needs\n" +
            "s1,3,4,10,0:10,08:00-25:99,\n" +   // row 2: bad time
            "s2,6,8,-5,15,,\n" +                 // row 3: negative demand
            "s3,0,10,5,,,freezer\n" +            // row 4: unknown equipment
            "s1,1,1,1,,,\n";                     // row 5: duplicate of row 2
        files["vehicles.csv"] = "id,depot,shift_start\nvan,hub,07:00\n"; // no capacity column
        using var job = new JobFolder(files);

        var e = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path));
        var p = e.Problems;
        Assert.Contains(p, x => x is { File: "vehicles.csv", Row: 1, Column: "capacity_<dim>" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 2, Column: "windows", Value: "08:00-25:99" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 3, Column: "demand_kg", Value: "-5" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 4, Column: "needs", Value: "freezer" });
        var dup = Assert.Single(p, x => x is { File: "stops.csv", Row: 5, Column: "id", Value: "s1" });
        Assert.Contains("row 2", dup.Problem);
        // demand_kg has no capacity_kg now that vehicles.csv lost its capacity columns
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 1, Column: "demand_kg" });
    }

    [Fact]
    public void Header_and_cell_problems_are_each_reported()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = "id,x,y,demand_kg,sevrice,windows\ns1,3,abc,,,10:00-09:00\n,1,1,,,08:00-09:00;08:30-10:00\n";
        files["vehicles.csv"] = "id,depot,capacity_kg,shift_start,shift_end,count\nvan,nowhere,-1,18:00,08:00,0\n";
        files["settings.json"] = "{\n \"objective\": \"fastest\",\n \"travel\": { \"speedKmh\": 0 },\n \"colour\": 1,\n \"rules\": { \"capacity\": { \"hard\": false } }\n}";
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        var unknown = Assert.Single(p, x => x is { File: "stops.csv", Row: 1, Column: "sevrice" });
        Assert.Contains("'service'", unknown.Fix);
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 2, Column: "y", Value: "abc" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 2, Column: "windows", Value: "10:00-09:00" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 3, Column: "id" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 3, Column: "windows", Value: "08:30-10:00" });
        Assert.Contains(p, x => x is { File: "vehicles.csv", Row: 2, Column: "depot", Value: "nowhere" });
        Assert.Contains(p, x => x is { File: "vehicles.csv", Row: 2, Column: "capacity_kg", Value: "-1" });
        Assert.Contains(p, x => x is { File: "vehicles.csv", Row: 2, Column: "shift_end" });
        Assert.Contains(p, x => x is { File: "vehicles.csv", Row: 2, Column: "count", Value: "0" });
        Assert.Contains(p, x => x is { File: "settings.json", Row: 2, Position: 2, JsonPath: "objective" });
        Assert.Contains(p, x => x is { File: "settings.json", Row: 3, Position: 14, JsonPath: "travel.speedKmh" });
        Assert.Contains(p, x => x is { File: "settings.json", Row: 4, JsonPath: "colour" });
        Assert.Contains(p, x => x is { File: "settings.json", JsonPath: "rules.capacity.pricePerUnit" });
    }

    [Fact]
    public void Missing_files_bad_json_and_bad_quoting_become_problems()
    {
        var files = JobFolder.ValidPlanar();
        files.Remove("depots.csv");
        files["settings.json"] = "{\n  \"seed\": 1\n  \"objective\": \"cost\"\n}";
        files["stops.csv"] = "id,x,y\ns1,1,2\ns2,\"3,4\n";
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        Assert.Contains(p, x => x is { File: "depots.csv", Row: null });
        Assert.Contains(p, x => x is { File: "settings.json", Row: 3 });
        Assert.Contains(p, x => x.File == "stops.csv" && x.Row == 3 && x.Problem.Contains("quote", StringComparison.Ordinal));
    }

    [Fact]
    public void Mixed_coordinates_and_out_of_range_degrees_are_reported()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = "id,lat,lon,demand_kg\ns1,95,10,1\ns2,45,-190,1\n";
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 2, Column: "lat", Value: "95" });
        Assert.Contains(p, x => x is { File: "stops.csv", Row: 3, Column: "lon", Value: "-190" });
        Assert.Contains(p, x => x is { File: "depots.csv", Row: 1 } && x.Problem.Contains("coordinate systems", StringComparison.Ordinal));
    }

    [Fact]
    public void Lat_lon_job_uses_great_circle_times_detour()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = "id,lat,lon,demand_kg\nbeta,48.8566,2.3522,1\n";
        files["depots.csv"] = "id,lat,lon\nhub,51.5074,-0.1278\n";
        files["settings.json"] = "{ \"travel\": { \"speedKmh\": 50, \"detourFactor\": 1.2 } }";
        using var job = new JobFolder(files);

        var inst = CsvJobReader.Read(job.Path).Instance;
        Assert.Equal(DistanceRule.GreatCircle, inst.Travel.Rule);
        double km = GreatCircle.Kilometres(51.5074, -0.1278, 48.8566, 2.3522) * 1.2;
        Assert.Equal(km, inst.Travel.Distance(inst.DepotLocation(0), 0), 9);
        Assert.Equal(km * 60 / 50, inst.Travel.Duration(inst.DepotLocation(0), 0), 9);
        // London-Paris great circle is about 344 km (from memory; a sanity bound, not a precise check).
        Assert.InRange(km / 1.2, 330, 355);
        Assert.Equal(2.3522, inst.Stops[0].X); // X is longitude for plotting
    }

    [Fact]
    public void Matrix_job_takes_arcs_from_matrix_and_fills_the_reverse_pair()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = "id,x,y,demand_kg\na,1,0,1\nb,2,0,1\n";
        files["matrix.csv"] = "from,to,distance,duration\nhub,a,7,0:12\na,hub,8,13\nhub,b,9,20\na,b,4.5,6\nb,a,5,7\n";
        using var job = new JobFolder(files);

        var inst = CsvJobReader.Read(job.Path).Instance;
        int hub = inst.DepotLocation(0);
        Assert.Equal(DistanceRule.Matrix, inst.Travel.Rule);
        Assert.Equal(7, inst.Travel.Distance(hub, 0));
        Assert.Equal(12, inst.Travel.Duration(hub, 0));
        Assert.Equal(8, inst.Travel.Distance(0, hub));
        Assert.Equal(9, inst.Travel.Distance(1, hub)); // (b,hub) absent: taken equal to (hub,b)
        Assert.Equal(20, inst.Travel.Duration(1, hub));
        Assert.Equal(5, inst.Travel.Distance(1, 0));
        Assert.Equal(0, inst.Travel.Distance(0, 0));
    }

    [Fact]
    public void Matrix_problems_name_unknown_ids_and_missing_pairs()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = "id,x,y,demand_kg\na,1,0,1\nb,2,0,1\n";
        files["matrix.csv"] = "from,to,distance,duration\nhub,a,7,12\nhub,zz,9,20\n";
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;
        Assert.Contains(p, x => x is { File: "matrix.csv", Row: 3, Column: "to", Value: "zz" });
        Assert.Contains(p, x => x is { File: "matrix.csv", Value: "a,b" });
        Assert.Contains(p, x => x is { File: "matrix.csv", Value: "b,hub" });
    }
}
