using System.Text.Json;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Formats.Output;

/// <summary>
/// routes.geojson for jobs in degrees (RFC 7946: WGS 84, positions as [longitude, latitude]): one LineString per
/// vehicle used, from its depot through its stops in visiting order and back, and one Point per depot and per stop.
/// Planar jobs get none: their x/y kilometres have no place on the Earth.
/// </summary>
public static class RoutesGeoJsonWriter
{
    public const string FileName = "routes.geojson";

    public static void Write(string path, Instance instance, PlanEvaluation plan) =>
        AtomicFile.Write(path, stream =>
        {
            using var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = JsonText.Encoder });
            Write(json, instance, plan);
        });

    public static void Write(Utf8JsonWriter json, Instance instance, PlanEvaluation plan)
    {
        var units = instance.Units;
        json.WriteStartObject();
        json.WriteString("type", "FeatureCollection");
        json.WriteStartArray("features");
        var vehicleOf = new string?[instance.StopCount];
        var sequence = new int[instance.StopCount];
        var visitOf = new VisitTimes[instance.StopCount];
        int used = 0;
        foreach (var route in plan.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            var v = instance.Vehicles[route.Vehicle];
            json.WriteStartObject();
            json.WriteString("type", "Feature");
            json.WriteStartObject("geometry");
            json.WriteString("type", "LineString");
            json.WriteStartArray("coordinates");
            Position(json, instance.Depots[v.StartDepot].X, instance.Depots[v.StartDepot].Y);
            for (int k = 0; k < route.Stops.Length; k++)
            {
                var stop = instance.Stops[route.Stops[k]];
                Position(json, stop.X, stop.Y);
                vehicleOf[route.Stops[k]] = v.Id;
                sequence[route.Stops[k]] = k + 1;
                visitOf[route.Stops[k]] = route.Visits[k];
            }

            Position(json, instance.Depots[v.EndDepot].X, instance.Depots[v.EndDepot].Y);
            json.WriteEndArray();
            json.WriteEndObject();
            json.WriteStartObject("properties");
            json.WriteString("kind", "route");
            json.WriteString("vehicle", v.Id);
            json.WriteNumber("stops", route.Stops.Length);
            json.WriteNumber("distance", Math.Round(route.Metrics.Distance, 3));
            json.WriteNumber("duration", Math.Round(route.Metrics.Duration, 2));
            json.WriteString("colour", RouteColours.Of(used));
            json.WriteEndObject();
            json.WriteEndObject();
            used++;
        }

        foreach (var depot in instance.Depots)
        {
            PointStart(json, depot.X, depot.Y);
            json.WriteString("kind", "depot");
            json.WriteString("id", depot.Id);
            json.WriteString("name", depot.Name);
            json.WriteEndObject();
            json.WriteEndObject();
        }

        for (int s = 0; s < instance.StopCount; s++)
        {
            var stop = instance.Stops[s];
            PointStart(json, stop.X, stop.Y);
            json.WriteString("kind", "stop");
            json.WriteString("id", stop.Id);
            json.WriteString("name", stop.Name);
            json.WriteString("address", stop.Address);
            bool served = vehicleOf[s] is not null;
            json.WriteBoolean("unserved", !served);
            if (served)
            {
                json.WriteString("vehicle", vehicleOf[s]);
                json.WriteNumber("sequence", sequence[s]);
                json.WriteString("arrival", units.Format(visitOf[s].Arrival));
                json.WriteString("window", TimeText.Window(instance, RoutesCsvWriter.WindowUsed(stop, visitOf[s].Arrival)));
                json.WriteNumber("minutesLate", Math.Round(visitOf[s].Late, 2));
            }
            else
            {
                json.WriteNull("vehicle");
                json.WriteNull("sequence");
                json.WriteNull("arrival");
                json.WriteString("window", string.Join(";", stop.Windows.Select(w => TimeText.Window(instance, w))));
                json.WriteNull("minutesLate");
            }

            json.WriteEndObject();
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
        json.Flush();
    }

    /// <summary>Opens a Point feature and its properties object; the caller writes the properties and closes both.</summary>
    private static void PointStart(Utf8JsonWriter json, double lon, double lat)
    {
        json.WriteStartObject();
        json.WriteString("type", "Feature");
        json.WriteStartObject("geometry");
        json.WriteString("type", "Point");
        json.WritePropertyName("coordinates");
        Position(json, lon, lat);
        json.WriteEndObject();
        json.WriteStartObject("properties");
    }

    /// <summary>[longitude, latitude] (RFC 7946 section 3.1.1); six decimals are about 0.1 m.</summary>
    private static void Position(Utf8JsonWriter json, double lon, double lat)
    {
        json.WriteStartArray();
        json.WriteNumberValue(Math.Round(lon, 6));
        json.WriteNumberValue(Math.Round(lat, 6));
        json.WriteEndArray();
    }
}
