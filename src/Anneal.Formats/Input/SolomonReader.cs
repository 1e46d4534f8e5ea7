using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input.Text;

namespace Anneal.Formats.Input;

/// <summary>
/// Solomon (1987) VRPTW text format, also used by Gehring &amp; Homberger (1999): a name line, a VEHICLE section
/// (NUMBER, CAPACITY) and a CUSTOMER section whose row 0 is the depot. Travel time equals Euclidean distance
/// in double precision; every rule is hard.
/// </summary>
public static class SolomonReader
{
    /// <summary>Upper bound on NUMBER so a typo cannot make the reader allocate millions of vehicles.</summary>
    public const int MaxVehicles = 100_000;

    private static readonly string[] Columns = ["CUST NO.", "XCOORD.", "YCOORD.", "DEMAND", "READY TIME", "DUE DATE", "SERVICE TIME"];

    private const string RowFix = "write seven numbers per customer row: number, x, y, demand, ready time, due date, service time";

    public static bool LooksLike(string text)
    {
        bool vehicle = false;
        foreach (var line in TextLines.Split(text))
        {
            string t = line.Text.Trim();
            if (t.Equals("VEHICLE", StringComparison.OrdinalIgnoreCase))
            {
                vehicle = true;
            }
            else if (vehicle && t.Equals("CUSTOMER", StringComparison.OrdinalIgnoreCase))
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
        var lines = TextLines.Split(text);
        int vehicleAt = FindKeyword(lines, "VEHICLE", 0);
        int customerAt = FindKeyword(lines, "CUSTOMER", vehicleAt < 0 ? 0 : vehicleAt + 1);
        if (vehicleAt < 0)
        {
            log.Add(null, "VEHICLE", null, "the VEHICLE section is missing", "add a line VEHICLE, a header line NUMBER CAPACITY and a line with the two numbers");
        }

        if (customerAt < 0)
        {
            log.Add(null, "CUSTOMER", null, "the CUSTOMER section is missing (it must follow the VEHICLE section)", "add a line CUSTOMER, a header line and one row per customer, the depot first as number 0");
        }

        log.ThrowIfAny();

        var (count, capacity) = ReadFleet(lines, vehicleAt, customerAt, log);
        var rows = ReadCustomers(lines, customerAt, log);
        log.ThrowIfAny();
        return Build(lines, fileName, count, capacity, rows);
    }

    private static int FindKeyword(List<TextLine> lines, string keyword, int from)
    {
        for (int i = from; i < lines.Count; i++)
        {
            if (lines[i].Tokens.Length == 1 && lines[i].Tokens[0].Equals(keyword, StringComparison.OrdinalIgnoreCase))
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>The first all-numeric line between VEHICLE and CUSTOMER holds NUMBER and CAPACITY.</summary>
    private static (int Count, double Capacity) ReadFleet(List<TextLine> lines, int vehicleAt, int customerAt, ProblemLog log)
    {
        for (int i = vehicleAt + 1; i < customerAt; i++)
        {
            var line = lines[i];
            if (line.IsBlank || !Numbers.LooksNumeric(line.Tokens[0]))
            {
                continue;
            }

            if (line.Tokens.Length != 2)
            {
                log.Add(line.Row, "NUMBER CAPACITY", line.Text.Trim(), $"the vehicle line has {line.Tokens.Length} values, expected 2",
                    "write the number of vehicles and their capacity, e.g. '25 200'");
                return (0, 0);
            }

            int count = 0;
            if (!Numbers.TryWhole(line.Tokens[0], out long n) || n < 1 || n > MaxVehicles)
            {
                log.Add(line.Row, "NUMBER", line.Tokens[0], "the number of vehicles is not a whole number from 1 to " + MaxVehicles,
                    "write a positive whole number of vehicles");
            }
            else
            {
                count = (int)n;
            }

            if (!Numbers.TryFinite(line.Tokens[1], out double capacity) || capacity < 0)
            {
                log.Add(line.Row, "CAPACITY", line.Tokens[1], "the capacity is not a finite number of at least 0",
                    "write the vehicle capacity as a non-negative number");
            }
            else if (!log.InRange(line.Row, "CAPACITY", line.Tokens[1], capacity, Limits.BenchmarkQuantity, "the vehicle capacity"))
            {
                capacity = 0;
            }

            return (count, capacity);
        }

        log.Add(lines[vehicleAt].Row, "NUMBER", null, "the VEHICLE section has no line with the number of vehicles and the capacity",
            "add a line such as '25 200' below the NUMBER CAPACITY header");
        return (0, 0);
    }

    private static List<(int Row, string Id, double[] Values)> ReadCustomers(List<TextLine> lines, int customerAt, ProblemLog log)
    {
        var rows = new List<(int Row, string Id, double[] Values)>();
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        int dataRows = 0;
        for (int i = customerAt + 1; i < lines.Count; i++)
        {
            var line = lines[i];
            if (line.IsBlank)
            {
                continue;
            }

            // Header lines sit between CUSTOMER and the first row; after that every line is a row.
            if (dataRows == 0 && !Numbers.LooksNumeric(line.Tokens[0]))
            {
                continue;
            }

            dataRows++;
            if (line.Tokens.Length != Columns.Length)
            {
                log.Add(line.Row, null, line.Text.Trim(), $"the customer row has {line.Tokens.Length} values, expected {Columns.Length}", RowFix);
                continue;
            }

            var values = new double[Columns.Length];
            bool ok = true;
            for (int c = 0; c < Columns.Length; c++)
            {
                if (!Numbers.TryFinite(line.Tokens[c], out values[c]))
                {
                    log.Add(line.Row, Columns[c], line.Tokens[c], "not a finite number", RowFix);
                    ok = false;
                }
            }

            ok &= CheckRow(line, values, dataRows == 1, log);
            if (!ok)
            {
                continue;
            }

            string id = ((long)values[0]).ToString(System.Globalization.CultureInfo.InvariantCulture);
            if (seen.TryGetValue(id, out int first))
            {
                log.Add(line.Row, Columns[0], line.Tokens[0], $"customer number {id} appears twice (first on row {first})", "give every customer its own number");
                continue;
            }

            seen[id] = line.Row;
            rows.Add((line.Row, id, values));
        }

        if (rows.Count == 0 && log.Count == 0)
        {
            log.Add(lines[customerAt].Row, Columns[0], null, "the CUSTOMER section has no rows", "add the depot as row 0 and one row per customer");
        }

        return rows;
    }

    private static bool CheckRow(TextLine line, double[] v, bool isFirst, ProblemLog log)
    {
        bool ok = true;
        if (v[0] < 0 || v[0] != Math.Floor(v[0]))
        {
            log.Add(line.Row, Columns[0], line.Tokens[0], "the customer number is not a whole number of at least 0", RowFix);
            ok = false;
        }
        else if (isFirst && v[0] != 0)
        {
            log.Add(line.Row, Columns[0], line.Tokens[0], "the first customer row must be the depot, number 0", "put the depot first, numbered 0");
            ok = false;
        }

        if (v[3] < 0)
        {
            log.Add(line.Row, Columns[3], line.Tokens[3], "the demand is negative", "write a demand of at least 0");
            ok = false;
        }

        if (v[4] > v[5])
        {
            log.Add(line.Row, Columns[5], line.Tokens[5], $"the due date is before the ready time {line.Tokens[4]}", "make the due date at least the ready time");
            ok = false;
        }

        if (v[6] < 0)
        {
            log.Add(line.Row, Columns[6], line.Tokens[6], "the service time is negative", "write a service time of at least 0");
            ok = false;
        }

        if (!ok)
        {
            return false;
        }

        ok &= log.InRange(line.Row, Columns[1], line.Tokens[1], v[1], Limits.BenchmarkCoordinate, "the x coordinate");
        ok &= log.InRange(line.Row, Columns[2], line.Tokens[2], v[2], Limits.BenchmarkCoordinate, "the y coordinate");
        ok &= log.InRange(line.Row, Columns[3], line.Tokens[3], v[3], Limits.BenchmarkQuantity, "the demand");
        ok &= log.InRange(line.Row, Columns[4], line.Tokens[4], v[4], Limits.BenchmarkTime, "the ready time");
        ok &= log.InRange(line.Row, Columns[5], line.Tokens[5], v[5], Limits.BenchmarkTime, "the due date");
        ok &= log.InRange(line.Row, Columns[6], line.Tokens[6], v[6], Limits.BenchmarkTime, "the service time");

        return ok;
    }

    private static Instance Build(List<TextLine> lines, string fileName, int count, double capacity, List<(int Row, string Id, double[] Values)> rows)
    {
        var depotRow = rows[0].Values;
        int n = rows.Count - 1;
        var stops = new Stop[n];
        var x = new double[n + 1];
        var y = new double[n + 1];
        for (int i = 0; i < n; i++)
        {
            var v = rows[i + 1].Values;
            stops[i] = new Stop
            {
                Id = rows[i + 1].Id,
                X = v[1],
                Y = v[2],
                Demand = [v[3]],
                ServiceTime = v[6],
                Windows = [new TimeWindow(v[4], v[5])],
            };
            x[i] = v[1];
            y[i] = v[2];
        }

        x[n] = depotRow[1];
        y[n] = depotRow[2];
        var depots = new[] { new Depot { Id = rows[0].Id, X = depotRow[1], Y = depotRow[2] } };
        var vehicles = BenchmarkFleet.Identical(count, capacity, depotRow[4], depotRow[5]);
        return new Instance(NameOf(lines, fileName), stops, depots, vehicles, ["demand"], [], RuleSet.AllHard, Objective.Distance,
            TravelTable.Planar(x, y, roundToInteger: false), Units.Plain);
    }

    private static string NameOf(List<TextLine> lines, string fileName)
    {
        foreach (var line in lines)
        {
            if (!line.IsBlank)
            {
                string t = line.Text.Trim();
                return t.Equals("VEHICLE", StringComparison.OrdinalIgnoreCase) ? Path.GetFileName(fileName) : t;
            }
        }

        return Path.GetFileName(fileName);
    }
}
