using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input.Csv;

namespace Anneal.Formats.Input;

/// <summary>
/// Reads a CSV job folder (stops.csv, depots.csv, vehicles.csv, optional matrix.csv and settings.json) into an
/// instance. Every file is checked in full and all problems are reported together in one <see cref="InputException"/>.
/// </summary>
public static class CsvJobReader
{
    public const string Format = "csv-job";

    /// <exception cref="InputException">with every problem found in the folder's files.</exception>
    public static LoadedInput Read(string folder)
    {
        var problems = new ProblemList();
        if (!Directory.Exists(folder))
        {
            problems.Add(folder, null, null, null, "no such folder", "give the path of a folder holding stops.csv, depots.csv and vehicles.csv");
            problems.ThrowIfAny();
        }

        var settings = ReadSettings(folder, problems);
        var depotTable = Table(folder, DepotsTable.FileName, required: true, problems);
        var vehicleTable = Table(folder, VehiclesTable.FileName, required: true, problems);
        var stopTable = Table(folder, StopsTable.FileName, required: true, problems);
        var matrixTable = Table(folder, MatrixTable.FileName, required: false, problems);

        (List<Depot> Depots, IdRegistry Ids, CoordinateSystem System)? depots = depotTable is null ? null : DepotsTable.Read(depotTable, problems);
        var equipment = new EquipmentIndex();
        List<Vehicle>? vehicles = null;
        List<string>? dimensions = null;
        if (vehicleTable is not null)
        {
            (vehicles, dimensions) = VehiclesTable.Read(vehicleTable, depots?.Ids ?? new IdRegistry(), depots?.Depots.Count ?? 0, equipment, problems);
        }

        var offered = vehicleTable is null ? null : new HashSet<string>(equipment.Names, StringComparer.OrdinalIgnoreCase);
        (List<Stop> Stops, IdRegistry Ids, CoordinateSystem System)? stops = stopTable is null ? null : StopsTable.Read(stopTable, dimensions, offered, equipment, problems);

        if (stops is { } s && depots is { } d && s.System != CoordinateSystem.None && d.System != CoordinateSystem.None && s.System != d.System)
        {
            problems.Add(DepotsTable.FileName, 1, null, null, "depots.csv and stops.csv use different coordinate systems (x/y and lat/lon)",
                "use x and y in both files, or lat and lon in both");
        }

        (double[] Distance, double[] Duration)? matrix = null;
        if (matrixTable is not null && stops is not null && depots is not null)
        {
            var (locations, names) = Locations(stops.Value.Stops, depots.Value.Depots, problems);
            matrix = MatrixTable.Read(matrixTable, locations, names, problems);
        }

        problems.ThrowIfAny();
        var instance = Build(folder, stops!.Value.Stops, stops.Value.System, depots!.Value.Depots, vehicles!, dimensions!, equipment, settings, matrix);
        return new LoadedInput(instance, settings.Job, Format, folder) { ReadAs = ReadAs([depotTable, vehicleTable, stopTable, matrixTable]) };
    }

    /// <summary>The dialect in words: once when every file shares it, else per file.</summary>
    private static string ReadAs(CsvTable?[] tables)
    {
        var read = new List<(string File, string Dialect)>();
        foreach (var table in tables)
        {
            if (table is not null)
            {
                read.Add((table.File, table.Dialect.Name + (table.DecimalCommasRead > 0 ? ", decimal commas" : string.Empty)));
            }
        }

        var first = read[0].Dialect;
        if (read.TrueForAll(r => r.Dialect == first))
        {
            return first;
        }

        return string.Join("; ", read.Select(r => r.File + " " + r.Dialect));
    }

    private static Instance Build(string folder, List<Stop> stops, CoordinateSystem system, List<Depot> depots, List<Vehicle> vehicles,
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

        string name = Path.GetFileName(Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder)));
        return new Instance(name, stops, depots, vehicles, dimensions, equipment.Names.ToArray(), settings.Rules, settings.Objective, travel,
            timeUnit: "min", timeUnitsPerHour: 60);
    }

    /// <summary>Location index of every id for matrix.csv: stops first, then depots.</summary>
    private static (Dictionary<string, int> Locations, List<string> Names) Locations(List<Stop> stops, List<Depot> depots, ProblemList problems)
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
                problems.Add(DepotsTable.FileName, null, "id", depot.Id, "a stop and a depot share this id, so matrix.csv cannot tell them apart",
                    "give the depot an id no stop uses");
            }

            names.Add(depot.Id);
        }

        return (locations, names);
    }

    private static SettingsFile ReadSettings(string folder, ProblemList problems)
    {
        var path = Path.Combine(folder, SettingsFile.FileName);
        if (!File.Exists(path))
        {
            return new SettingsFile();
        }

        var bytes = ReadBytes(path, SettingsFile.FileName, problems);
        return bytes is null ? new SettingsFile() : SettingsFile.Read(bytes, problems);
    }

    private static CsvTable? Table(string folder, string file, bool required, ProblemList problems)
    {
        var path = Path.Combine(folder, file);
        if (!File.Exists(path))
        {
            if (required)
            {
                problems.Add(file, null, null, null, "the file is missing", $"add {file} to the job folder (names are lower case)");
            }

            return null;
        }

        var bytes = ReadBytes(path, file, problems);
        if (bytes is null)
        {
            return null;
        }

        // UTF-8 with or without a BOM; malformed bytes become U+FFFD and then fail as values, not as exceptions.
        var text = new System.Text.UTF8Encoding(false, false).GetString(bytes);
        if (text.Length > 0 && text[0] == '\uFEFF')
        {
            text = text[1..];
        }

        return CsvTable.Parse(text, file, problems);
    }

    private static byte[]? ReadBytes(string path, string file, ProblemList problems)
    {
        try
        {
            return File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            problems.Add(file, null, null, null, "the file cannot be read: " + e.Message, "check that the file is not locked and may be read");
            return null;
        }
    }
}
