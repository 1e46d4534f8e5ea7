using System.Text.Json;
using Anneal.Cli;
using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO.Converters;

namespace Anneal.Tests.Formats.Output;

/// <summary>
/// routes.geojson read back by a general-purpose GeoJSON reader (NetTopologySuite.IO.GeoJSON4STJ), its positions
/// checked against the input's lat/lon (RFC 7946 section 3.1.1: [longitude, latitude]).
/// </summary>
public sealed class RoutesGeoJsonTests : CommandTest
{
    private static readonly JsonSerializerOptions Reader = new() { Converters = { new GeoJsonConverterFactory() } };

    private static string Demo => Path.Combine(BenchmarkData.RepoRoot, "instances", "merrowdale");

    [Fact]
    public void A_general_purpose_reader_loads_it_and_every_position_is_the_inputs_longitude_latitude()
    {
        var instance = InputLoader.Load(Demo).Instance;
        Assert.True(instance.LatLon);
        var plan = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, [0, 1, 2, 3]), new PlannedRoute(1, [4, 5, 6])]));
        string path = Path.Combine(Dir, RoutesGeoJsonWriter.FileName);

        RoutesGeoJsonWriter.Write(path, instance, plan);

        var features = JsonSerializer.Deserialize<FeatureCollection>(File.ReadAllText(path), Reader)!;
        var lines = features.Where(f => f.Geometry is LineString).ToList();
        var points = features.Where(f => f.Geometry is Point).ToList();
        Assert.Equal(2, lines.Count);
        Assert.Equal(instance.StopCount + instance.Depots.Count, points.Count);

        // The first route: depot, stops 0..3 in order, depot.
        var coordinates = ((LineString)lines[0].Geometry).Coordinates;
        var depot = instance.Depots[0];
        Assert.Equal(6, coordinates.Length);
        Assert.Equal(depot.X, coordinates[0].X, 6);
        Assert.Equal(depot.Y, coordinates[0].Y, 6);
        for (int k = 0; k < 4; k++)
        {
            Assert.Equal(instance.Stops[k].X, coordinates[k + 1].X, 6); // longitude first
            Assert.Equal(instance.Stops[k].Y, coordinates[k + 1].Y, 6);
        }

        Assert.Equal("van-1", lines[0].Attributes["vehicle"]);
        Assert.Equal(4L, Convert.ToInt64(lines[0].Attributes["stops"], System.Globalization.CultureInfo.InvariantCulture));
        var unserved = points.Single(p => (string)p.Attributes["id"] == instance.Stops[11].Id);
        Assert.True((bool)unserved.Attributes["unserved"]);
        var served = points.Single(p => (string)p.Attributes["id"] == instance.Stops[1].Id);
        Assert.Equal(instance.Stops[1].Name, served.Attributes["name"]);
        Assert.Equal(instance.Stops[1].Y, ((Point)served.Geometry).Y, 6);
    }

    [Fact]
    public void A_solve_of_the_lat_lon_demo_leaves_a_map_file_and_a_planar_job_none()
    {
        // Real runs of `anneal solve` (insertion only, for speed): the run folder of the lat/lon demo holds
        // routes.geojson, whose route lines visit the stops of routes.csv; harbour-small (planar x/y in km) gets none.
        string latLon = Path.Combine(Dir, "merrowdale");
        string planar = Path.Combine(Dir, "harbour-small");

        int a = CliApp.Run(["solve", Demo, "--solvers", "insertion", "--time", "2", "--out", latLon, "--quiet"], Out, Err);
        int b = CliApp.Run(["solve", Path.Combine(BenchmarkData.RepoRoot, "instances", "harbour-small"), "--solvers", "insertion", "--time", "2", "--out", planar, "--quiet"], Out, Err);

        Assert.Equal(ExitCodes.Success, a);
        Assert.Equal(ExitCodes.Success, b);
        Assert.True(File.Exists(Path.Combine(planar, "routes.csv")), All);
        Assert.False(File.Exists(Path.Combine(planar, RoutesGeoJsonWriter.FileName)), "a planar job has no place on the Earth");
        Assert.Empty(Directory.GetFiles(planar, "*.geojson*"));

        var features = JsonSerializer.Deserialize<FeatureCollection>(File.ReadAllText(Path.Combine(latLon, RoutesGeoJsonWriter.FileName)), Reader)!;
        var instance = InputLoader.Load(Demo).Instance;
        var lines = features.Where(f => f.Geometry is LineString).ToList();
        int served = lines.Sum(f => ((LineString)f.Geometry).Coordinates.Length - 2);
        var csvStops = File.ReadAllLines(Path.Combine(latLon, "routes.csv")).Skip(1).Count(l => l.Split(',')[2] == "stop");
        Assert.Equal(csvStops, served);
        Assert.Equal(instance.StopCount, served); // the demo is feasible: every stop on a line
        foreach (var line in lines)
        {
            foreach (var c in ((LineString)line.Geometry).Coordinates)
            {
                Assert.Contains(instance.Stops.Select(s => (s.X, s.Y)).Concat(instance.Depots.Select(d => (d.X, d.Y))),
                    p => Math.Abs(p.X - c.X) < 1e-6 && Math.Abs(p.Y - c.Y) < 1e-6);
            }
        }
    }
}
