using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input.Text;

namespace Anneal.Formats.Input;

/// <summary>
/// CVRPLIB instances in TSPLIB 95 text form (Reinelt 1991): specification lines KEY : value, then
/// NODE_COORD_SECTION, DEMAND_SECTION and DEPOT_SECTION. Only EUC_2D with one depot is read; arcs are
/// rounded to the nearest integer, there are no windows and the fleet is unlimited unless VEHICLES says otherwise.
/// <para>
/// Stop ids are the CVRPLIB customer numbers, node number minus one (the depot, node 1, is 0), because that
/// is how CVRPLIB solution files list routes.
/// </para>
/// </summary>
public static class CvrplibReader
{
    public const int MaxNodes = 200_000;

    private const string CoordSection = "NODE_COORD_SECTION";
    private const string DemandSection = "DEMAND_SECTION";
    private const string DepotSection = "DEPOT_SECTION";

    private static readonly string[] HeaderKeys = ["NAME", "COMMENT", "TYPE", "DIMENSION", "EDGE_WEIGHT_TYPE", "CAPACITY", "VEHICLES"];

    public static bool LooksLike(string text)
    {
        foreach (var line in TextLines.Split(text))
        {
            if (line.Tokens.Length > 0 && KeyOf(line).Equals(CoordSection, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }

        return false;
    }

    /// <exception cref="InputException">with every problem found.</exception>
    public static Instance Parse(string text, string fileName)
    {
        var log = new ProblemLog(fileName);
        var file = new CvrplibFile();
        Scan(TextLines.Split(text), file, log);
        var spec = CheckSpecification(file, log);
        CheckNodes(file, spec.Dimension, log);
        log.ThrowIfAny();
        return Build(file, spec, fileName);
    }

    private static string KeyOf(TextLine line)
    {
        int colon = line.Text.IndexOf(':', StringComparison.Ordinal);
        return (colon >= 0 ? line.Text[..colon] : line.Tokens[0]).Trim().ToUpperInvariant();
    }

    private static void Scan(List<TextLine> lines, CvrplibFile file, ProblemLog log)
    {
        string? section = null;
        foreach (var line in lines)
        {
            if (line.IsBlank)
            {
                continue;
            }

            if (!Numbers.LooksNumeric(line.Tokens[0]))
            {
                string key = KeyOf(line);
                if (key == "EOF")
                {
                    return;
                }

                section = Keyword(line, key, file, log);
                continue;
            }

            switch (section)
            {
                case CoordSection: ReadCoord(line, file, log); break;
                case DemandSection: ReadDemand(line, file, log); break;
                case DepotSection: ReadDepots(line, file, log); break;
                case null:
                    log.Add(line.Row, null, line.Text.Trim(), "numbers outside any section",
                        "put node data below NODE_COORD_SECTION, DEMAND_SECTION or DEPOT_SECTION");
                    break;
                default: break; // inside an unsupported section, already reported
            }
        }
    }

    /// <summary>Records a specification line or opens a section; returns the section now open.</summary>
    private static string? Keyword(TextLine line, string key, CvrplibFile file, ProblemLog log)
    {
        if (key is CoordSection or DemandSection or DepotSection)
        {
            if (!file.Sections.Add(key))
            {
                log.Add(line.Row, key, null, $"{key} appears twice", "keep one " + key);
            }

            return key;
        }

        if (Array.IndexOf(HeaderKeys, key) < 0)
        {
            log.Add(line.Row, key, line.Text.Trim(), "unsupported keyword",
                "use only NAME, COMMENT, TYPE, DIMENSION, EDGE_WEIGHT_TYPE, CAPACITY, VEHICLES and the NODE_COORD, DEMAND and DEPOT sections");
            return "unsupported";
        }

        int colon = line.Text.IndexOf(':', StringComparison.Ordinal);
        string value = colon >= 0 ? line.Text[(colon + 1)..].Trim() : string.Join(' ', line.Tokens[1..]);
        if (!file.Header.TryAdd(key, (line.Row, value)))
        {
            log.Add(line.Row, key, value, $"{key} is given twice (first on row {file.Header[key].Row})", "keep one " + key + " line");
        }

        return null;
    }

    private static void ReadCoord(TextLine line, CvrplibFile file, ProblemLog log)
    {
        const string fix = "write one node per line: node number, x, y";
        if (line.Tokens.Length != 3)
        {
            log.Add(line.Row, CoordSection, line.Text.Trim(), $"the line has {line.Tokens.Length} values, expected 3", fix);
            return;
        }

        bool ok = Node(line, 0, CoordSection, log, out long node);
        if (!Numbers.TryFinite(line.Tokens[1], out double x))
        {
            log.Add(line.Row, "x", line.Tokens[1], "not a finite number", fix);
            ok = false;
        }
        else
        {
            ok &= log.InRange(line.Row, "x", line.Tokens[1], x, Limits.BenchmarkCoordinate, "the x coordinate");
        }

        if (!Numbers.TryFinite(line.Tokens[2], out double y))
        {
            log.Add(line.Row, "y", line.Tokens[2], "not a finite number", fix);
            ok = false;
        }
        else
        {
            ok &= log.InRange(line.Row, "y", line.Tokens[2], y, Limits.BenchmarkCoordinate, "the y coordinate");
        }

        if (ok && !file.Coords.TryAdd(node, (line.Row, x, y)))
        {
            log.Add(line.Row, CoordSection, line.Tokens[0], $"node {node} has coordinates twice (first on row {file.Coords[node].Row})", "give each node one line");
        }
    }

    private static void ReadDemand(TextLine line, CvrplibFile file, ProblemLog log)
    {
        const string fix = "write one node per line: node number, demand (at least 0)";
        if (line.Tokens.Length != 2)
        {
            log.Add(line.Row, DemandSection, line.Text.Trim(), $"the line has {line.Tokens.Length} values, expected 2", fix);
            return;
        }

        bool ok = Node(line, 0, DemandSection, log, out long node);
        if (!Numbers.TryFinite(line.Tokens[1], out double demand) || demand < 0)
        {
            log.Add(line.Row, "demand", line.Tokens[1], "the demand is not a finite number of at least 0", fix);
            ok = false;
        }
        else
        {
            ok &= log.InRange(line.Row, "demand", line.Tokens[1], demand, Limits.BenchmarkQuantity, "the demand");
        }

        if (ok && !file.Demands.TryAdd(node, (line.Row, demand)))
        {
            log.Add(line.Row, DemandSection, line.Tokens[0], $"node {node} has a demand twice (first on row {file.Demands[node].Row})", "give each node one line");
        }
    }

    private static void ReadDepots(TextLine line, CvrplibFile file, ProblemLog log)
    {
        for (int t = 0; t < line.Tokens.Length; t++)
        {
            if (file.DepotsClosed)
            {
                log.Add(line.Row, DepotSection, line.Tokens[t], "data after the -1 that ends DEPOT_SECTION", "end DEPOT_SECTION with a single -1 after the depot node");
                return;
            }

            if (line.Tokens[t] == "-1")
            {
                file.DepotsClosed = true;
                continue;
            }

            if (Node(line, t, DepotSection, log, out long node))
            {
                file.Depots.Add((line.Row, node));
            }
        }
    }

    private static bool Node(TextLine line, int token, string section, ProblemLog log, out long node)
    {
        if (Numbers.TryWhole(line.Tokens[token], out node) && node >= 1 && node <= MaxNodes)
        {
            return true;
        }

        log.Add(line.Row, section, line.Tokens[token], "not a node number (a whole number from 1 to DIMENSION)", "number nodes 1, 2, ... DIMENSION");
        return false;
    }

    private static CvrplibSpecification CheckSpecification(CvrplibFile file, ProblemLog log)
    {
        var spec = new CvrplibSpecification();
        string? type = Text(file, "TYPE", log, "add 'TYPE : CVRP'");
        if (type is not null && !type.Equals("CVRP", StringComparison.OrdinalIgnoreCase))
        {
            log.Add(file.Header["TYPE"].Row, "TYPE", type, "only TYPE CVRP is supported", "give a capacitated vehicle routing instance (TYPE : CVRP)");
        }

        string? edge = Text(file, "EDGE_WEIGHT_TYPE", log, "add 'EDGE_WEIGHT_TYPE : EUC_2D'");
        if (edge is not null && !edge.Equals("EUC_2D", StringComparison.OrdinalIgnoreCase))
        {
            log.Add(file.Header["EDGE_WEIGHT_TYPE"].Row, "EDGE_WEIGHT_TYPE", edge, "only EUC_2D is supported",
                "convert the instance to planar coordinates with EDGE_WEIGHT_TYPE : EUC_2D, or use a CSV job with a distance matrix");
        }

        string? dim = Text(file, "DIMENSION", log, "add 'DIMENSION : n' with the number of nodes including the depot");
        if (dim is not null)
        {
            if (Numbers.TryWhole(dim, out long d) && d >= 2 && d <= MaxNodes)
            {
                spec.Dimension = (int)d;
            }
            else
            {
                log.Add(file.Header["DIMENSION"].Row, "DIMENSION", dim, $"not a whole number from 2 to {MaxNodes}", "write the number of nodes including the depot");
            }
        }

        string? cap = Text(file, "CAPACITY", log, "add 'CAPACITY : q' with the vehicle capacity");
        if (cap is not null)
        {
            if (Numbers.TryFinite(cap, out double q) && q > 0)
            {
                if (log.InRange(file.Header["CAPACITY"].Row, "CAPACITY", cap, q, Limits.BenchmarkQuantity, "the vehicle capacity"))
                {
                    spec.Capacity = q;
                }
            }
            else
            {
                log.Add(file.Header["CAPACITY"].Row, "CAPACITY", cap, "the capacity is not a finite number above 0", "write the vehicle capacity as a positive number");
            }
        }

        if (file.Header.TryGetValue("VEHICLES", out var veh))
        {
            if (Numbers.TryWhole(veh.Value, out long k) && k >= 1 && k <= MaxNodes)
            {
                spec.Vehicles = (int)k;
            }
            else
            {
                log.Add(veh.Row, "VEHICLES", veh.Value, $"not a whole number from 1 to {MaxNodes}", "write the number of vehicles, or leave VEHICLES out for an unlimited fleet");
            }
        }

        spec.Name = file.Header.TryGetValue("NAME", out var name) && name.Value.Length > 0 ? name.Value : null;
        return spec;
    }

    private static string? Text(CvrplibFile file, string key, ProblemLog log, string fix)
    {
        if (file.Header.TryGetValue(key, out var entry))
        {
            return entry.Value;
        }

        log.Add(null, key, null, key + " is missing", fix);
        return null;
    }

    private static void CheckNodes(CvrplibFile file, int dimension, ProblemLog log)
    {
        foreach (string section in new[] { CoordSection, DemandSection, DepotSection })
        {
            if (!file.Sections.Contains(section))
            {
                log.Add(null, section, null, section + " is missing", "add " + section + " with one line per node" + (section == DepotSection ? ", then -1" : string.Empty));
            }
        }

        if (file.Depots.Count != 1 && file.Sections.Contains(DepotSection))
        {
            var (row, node) = file.Depots.Count > 1 ? file.Depots[1] : (0, 0L);
            log.Add(file.Depots.Count > 1 ? row : null, DepotSection, file.Depots.Count > 1 ? node.ToString(CultureInfo.InvariantCulture) : null,
                $"exactly one depot is supported, found {file.Depots.Count}", "list one depot node in DEPOT_SECTION, then -1");
        }

        if (dimension == 0)
        {
            return;
        }

        foreach (var (node, entry) in file.Coords)
        {
            OutOfRange(node, entry.Row, dimension, CoordSection, log);
        }

        foreach (var (node, entry) in file.Demands)
        {
            OutOfRange(node, entry.Row, dimension, DemandSection, log);
        }

        foreach (var (row, node) in file.Depots)
        {
            OutOfRange(node, row, dimension, DepotSection, log);
        }

        Complete(file.Coords.Keys, file.Sections.Contains(CoordSection), dimension, CoordSection, log);
        Complete(file.Demands.Keys, file.Sections.Contains(DemandSection), dimension, DemandSection, log);
    }

    private static void OutOfRange(long node, int row, int dimension, string section, ProblemLog log)
    {
        if (node > dimension)
        {
            log.Add(row, section, node.ToString(CultureInfo.InvariantCulture), $"node number above DIMENSION {dimension}", "number nodes 1 to DIMENSION, or correct DIMENSION");
        }
    }

    private static void Complete(IEnumerable<long> present, bool hasSection, int dimension, string section, ProblemLog log)
    {
        if (!hasSection)
        {
            return;
        }

        var have = new HashSet<long>(present);
        var missing = new List<string>();
        for (long node = 1; node <= dimension; node++)
        {
            if (!have.Contains(node))
            {
                missing.Add(node.ToString(CultureInfo.InvariantCulture));
            }
        }

        if (missing.Count > 0)
        {
            string list = string.Join(", ", missing.Take(10)) + (missing.Count > 10 ? ", ..." : string.Empty);
            log.Add(null, section, list, $"DIMENSION is {dimension} but {missing.Count} node(s) have no line in {section}",
                "give every node 1 to DIMENSION one line, or correct DIMENSION");
        }
    }

    private static Instance Build(CvrplibFile file, CvrplibSpecification spec, string fileName)
    {
        long depotNode = file.Depots[0].Node;
        int n = spec.Dimension - 1;
        var stops = new Stop[n];
        var x = new double[n + 1];
        var y = new double[n + 1];
        int i = 0;
        for (long node = 1; node <= spec.Dimension; node++)
        {
            if (node == depotNode)
            {
                continue;
            }

            var c = file.Coords[node];
            stops[i] = new Stop
            {
                Id = (node - 1).ToString(CultureInfo.InvariantCulture),
                X = c.X,
                Y = c.Y,
                Demand = [file.Demands[node].Demand],
                Windows = [TimeWindow.Always],
            };
            x[i] = c.X;
            y[i] = c.Y;
            i++;
        }

        var d = file.Coords[depotNode];
        x[n] = d.X;
        y[n] = d.Y;
        var depots = new[] { new Depot { Id = (depotNode - 1).ToString(CultureInfo.InvariantCulture), X = d.X, Y = d.Y } };
        int count = spec.Vehicles ?? Math.Max(1, n);
        var vehicles = new Vehicle[count];
        for (int k = 0; k < count; k++)
        {
            vehicles[k] = new Vehicle { Id = (k + 1).ToString(CultureInfo.InvariantCulture), Capacity = [spec.Capacity] };
        }

        return new Instance(spec.Name ?? Path.GetFileName(fileName), stops, depots, vehicles, ["demand"], [], RuleSet.AllHard, Objective.Distance,
            TravelTable.Planar(x, y, roundToInteger: true), Units.Plain);
    }
}
