using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Formats.Input.Text;

namespace Anneal.Formats.Input;

/// <summary>
/// Reads route files of the benchmark sets: one line <c>Route #k: id id ...</c> per vehicle, the depot implicit
/// at both ends, ids as in the instance; any other line (e.g. <c>Cost 827.3</c>) is ignored.
/// Route #k is driven by vehicle k (index k - 1).
/// </summary>
public static class RouteFileReader
{
    private const string Format = "write routes as 'Route #1: 5 3 7', numbering routes 1, 2, ...";

    /// <exception cref="InputException">when the file cannot be read or does not fit the instance.</exception>
    public static Plan Read(string path, Instance instance)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "the routes file cannot be read: " + FileTrouble.Reading(path, e),
                "give --routes the path of a route file (one line 'Route #1: 5 3 7' per vehicle)"));
        }

        return Parse(text, path, instance);
    }

    /// <exception cref="InputException">with every problem found.</exception>
    public static Plan Parse(string text, string fileName, Instance instance)
    {
        var log = new ProblemLog(fileName);
        var index = new Dictionary<string, int>(instance.StopCount, StringComparer.Ordinal);
        for (int s = 0; s < instance.StopCount; s++)
        {
            index[instance.Stops[s].Id] = s;
        }

        var routes = new List<PlannedRoute>();
        var vehicleRow = new Dictionary<int, int>();
        var stopRow = new Dictionary<int, int>();
        foreach (var line in TextLines.Split(text))
        {
            if (line.IsBlank || !line.Tokens[0].StartsWith("Route", StringComparison.OrdinalIgnoreCase))
            {
                continue;
            }

            if (!RouteNumber(line, instance, log, out int vehicle, out string label, out string[] ids))
            {
                continue;
            }

            if (vehicleRow.TryGetValue(vehicle, out int firstRow))
            {
                log.Add(line.Row, label, null, $"route number {vehicle + 1} appears twice (first on row {firstRow})", "give each route its own number");
                continue;
            }

            vehicleRow[vehicle] = line.Row;
            var stops = new List<int>(ids.Length);
            foreach (string token in ids)
            {
                if (Resolve(token, index, instance, line, label, log) is int s)
                {
                    if (stopRow.TryGetValue(s, out int seen))
                    {
                        log.Add(line.Row, label, token, $"stop {token} is visited twice (first on row {seen})", "list every stop on one route only, once");
                    }
                    else
                    {
                        stopRow[s] = line.Row;
                        stops.Add(s);
                    }
                }
            }

            routes.Add(new PlannedRoute(vehicle, stops.ToArray()));
        }

        log.ThrowIfAny();
        return new Plan(routes);
    }

    /// <summary>Splits "Route #k: ids" (also "Route #k : ids" and "Route k : ids", as some best-known tables write it) into the vehicle index and the id tokens.</summary>
    private static bool RouteNumber(TextLine line, Instance instance, ProblemLog log, out int vehicle, out string label, out string[] ids)
    {
        vehicle = -1;
        ids = [];
        string text = line.Text.Trim();
        int colon = text.IndexOf(':', StringComparison.Ordinal);
        int hash = text.IndexOf('#', StringComparison.Ordinal);
        label = colon > 0 ? text[..colon].Trim() : line.Tokens[0];
        if (hash > colon)
        {
            hash = -1;
        }

        int numberAt = hash >= 0 ? hash + 1 : 5;
        if (colon < 0 || text.Length < 5 || (hash >= 0 && text[5..hash].Trim().Length != 0))
        {
            log.Add(line.Row, null, text, "a route line must read 'Route #k: ids'", Format);
            return false;
        }

        string number = text[numberAt..colon].Trim();
        if (!long.TryParse(number, NumberStyles.None, CultureInfo.InvariantCulture, out long k) || k < 1)
        {
            log.Add(line.Row, label, number, "the route number is not a whole number of at least 1", Format);
            return false;
        }

        if (k > instance.Vehicles.Count)
        {
            log.Add(line.Row, label, number, $"route {k} needs vehicle {k}, but the instance has {instance.Vehicles.Count} vehicles",
                "use at most as many routes as the fleet has vehicles");
            return false;
        }

        vehicle = (int)(k - 1);
        ids = TextLines.Tokenize(text[(colon + 1)..]);
        return true;
    }

    private static int? Resolve(string token, Dictionary<string, int> index, Instance instance, TextLine line, string label, ProblemLog log)
    {
        // Ids as written first (CSV jobs use text ids such as FEN-01); numbers also in canonical form, so "007" finds stop 7.
        if (index.TryGetValue(token, out int exact))
        {
            return exact;
        }

        string id = long.TryParse(token, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out long n)
            ? n.ToString(CultureInfo.InvariantCulture)
            : token;
        if (index.TryGetValue(id, out int s))
        {
            return s;
        }

        bool depot = false;
        foreach (var d in instance.Depots)
        {
            depot |= d.Id == id;
        }

        log.Add(line.Row, label, token,
            depot ? $"{id} is the depot, which is implicit at both ends of a route" : $"no stop has id {id} in instance {instance.Name}",
            depot ? "leave the depot out of route lines" : "use the stop ids of the instance (the numbers of a benchmark file, the id column of stops.csv)");
        return null;
    }
}
