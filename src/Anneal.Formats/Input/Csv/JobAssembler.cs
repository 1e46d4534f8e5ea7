using Anneal.Core.Model;
using Anneal.Core.Travel;

namespace Anneal.Formats.Input.Csv;

/// <summary>A job's tables as read from its files or sheets (null when missing or unreadable), before they are checked against each other.</summary>
internal sealed record JobTables(CsvTable? Depots, CsvTable? Vehicles, CsvTable? Stops, CsvTable? Matrix, SettingsFile Settings);

/// <summary>
/// Turns a job's tables into an instance, wherever they came from (a CSV folder or a workbook): each table is read
/// in full, then checked against the others, and every problem is reported together in one <see cref="InputException"/>.
/// </summary>
internal static class JobAssembler
{
    /// <exception cref="InputException">with every problem found, including those already in <paramref name="problems"/>.</exception>
    public static Instance Assemble(string name, JobTables tables, ProblemList problems)
    {
        var settings = tables.Settings;
        (List<Depot> Depots, IdRegistry Ids, CoordinateSystem System)? depots = tables.Depots is null ? null : DepotsTable.Read(tables.Depots, problems);
        var equipment = new EquipmentIndex();
        List<Vehicle>? vehicles = null;
        List<string>? dimensions = null;
        if (tables.Vehicles is not null)
        {
            (vehicles, dimensions) = VehiclesTable.Read(tables.Vehicles, depots?.Ids ?? new IdRegistry(), depots?.Depots.Count ?? 0, equipment, problems, settings.Driving);
        }

        var offered = tables.Vehicles is null ? null : new HashSet<string>(equipment.Names, StringComparer.OrdinalIgnoreCase);
        (List<Stop> Stops, IdRegistry Ids, CoordinateSystem System)? stops = tables.Stops is null ? null : StopsTable.Read(tables.Stops, dimensions, offered, equipment, problems);

        if (stops is { } s && depots is { } d && s.System != CoordinateSystem.None && d.System != CoordinateSystem.None && s.System != d.System)
        {
            var names = tables.Depots!.Names;
            problems.Add(tables.Depots, 1, null, null, $"{names.Depots} and {names.Stops} use different coordinate systems (x/y and lat/lon)",
                "use x and y in both, or lat and lon in both");
        }

        (double[] Distance, double[] Duration)? matrix = null;
        if (tables.Matrix is not null && stops is not null && depots is not null)
        {
            var (locations, ids) = Locations(stops.Value.Stops, depots.Value.Depots, tables.Depots!, problems);
            matrix = MatrixTable.Read(tables.Matrix, locations, ids, problems);
        }

        problems.ThrowIfAny();
        return Build(name, stops!.Value.Stops, stops.Value.System, depots!.Value.Depots, vehicles!, dimensions!, equipment, settings, matrix);
    }

    /// <summary>The dialect in words: once when every table shares it, else per file.</summary>
    public static string ReadAs(JobTables tables)
    {
        var read = new List<(string File, string Dialect)>();
        foreach (var table in new[] { tables.Depots, tables.Vehicles, tables.Stops, tables.Matrix })
        {
            if (table is not null)
            {
                read.Add((table.File, table.Dialect.Name + (table.DecimalCommasRead > 0 ? ", decimal commas" : string.Empty)
                    + (table.Encoding is null ? string.Empty : ", " + table.Encoding)));
            }
        }

        var first = read[0].Dialect;
        return read.TrueForAll(r => r.Dialect == first) ? first : string.Join("; ", read.Select(r => r.File + " " + r.Dialect));
    }

    private static Instance Build(string name, List<Stop> stops, CoordinateSystem system, List<Depot> depots, List<Vehicle> vehicles,
        List<string> dimensions, EquipmentIndex equipment, SettingsFile settings, (double[] Distance, double[] Duration)? matrix)
    {
        int n = stops.Count + depots.Count;
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            (x[i], y[i]) = i < stops.Count ? (stops[i].X, stops[i].Y) : (depots[i - stops.Count].X, depots[i - stops.Count].Y);
        }

        TravelTable travel = matrix is { } m
            ? TravelTable.FromMatrix(x, y, m.Distance, m.Duration)
            : system == CoordinateSystem.LatLon
                ? TravelTable.GreatCircleKm(y, x, settings.DetourFactor, settings.SpeedKmh)
                : TravelTable.Planar(x, y, false, timePerDistance: 60.0 / settings.SpeedKmh);

        return new Instance(name, stops, depots, vehicles, dimensions, equipment.Names.ToArray(), settings.Rules, settings.Objective, travel,
            units: Units.Minutes) { LatLon = system == CoordinateSystem.LatLon };
    }

    /// <summary>Location index of every id for the matrix: stops first, then depots.</summary>
    private static (Dictionary<string, int> Locations, List<string> Names) Locations(List<Stop> stops, List<Depot> depots, CsvTable depotTable, ProblemList problems)
    {
        var locations = new Dictionary<string, int>(StringComparer.Ordinal);
        var names = new List<string>(stops.Count + depots.Count);
        foreach (var stop in stops)
        {
            locations.TryAdd(stop.Id, names.Count);
            names.Add(stop.Id);
        }

        foreach (var depot in depots)
        {
            if (!locations.TryAdd(depot.Id, names.Count) && locations[depot.Id] < stops.Count)
            {
                problems.Add(depotTable, null, "id", depot.Id, $"a stop and a depot share this id, so {depotTable.Names.Matrix} cannot tell them apart",
                    "give the depot an id no stop uses");
            }

            names.Add(depot.Id);
        }

        return (locations, names);
    }
}
