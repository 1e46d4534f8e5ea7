using System.Globalization;
using Anneal.Core.Model;
using Anneal.Core.Travel;
using Anneal.Formats.Input.Text;

namespace Anneal.Formats.Input;

/// <summary>
/// The Li &amp; Lim (2001, Proc. 13th IEEE ICTAI 160-167) pickup-and-delivery text format: a line "vehicles capacity
/// speed", then one line per task "task x y demand earliest latest service pickup delivery", task 0 the depot. A
/// pickup task has a positive demand and names its delivery task; the delivery has the negative demand and names its
/// pickup. Each pair becomes a collection stop (what it collects) and a delivery stop collecting from it, with stop ids
/// the file's task numbers. Euclidean distance in double precision, travel time distance / speed, every rule hard.
/// </summary>
public static class LiLimReader
{
    private static readonly string[] Columns = ["task", "x", "y", "demand", "earliest", "latest", "service", "pickup", "delivery"];

    private const string RowFix = "write nine numbers per task: task, x, y, demand, earliest, latest, service, pickup task, delivery task";

    /// <summary>A first line of three numbers followed by a line of nine.</summary>
    public static bool LooksLike(string text)
    {
        var lines = TextLines.Split(text).Where(l => !l.IsBlank).Take(2).ToList();
        return lines.Count == 2 && lines[0].Tokens.Length == 3 && lines[1].Tokens.Length == Columns.Length
            && lines[0].Tokens.All(Numbers.LooksNumeric) && lines[1].Tokens.All(Numbers.LooksNumeric);
    }

    /// <exception cref="InputException">with every problem found.</exception>
    public static Instance Parse(string text, string fileName)
    {
        var log = new ProblemLog(fileName);
        var lines = TextLines.Split(text).Where(l => !l.IsBlank).ToList();
        if (lines.Count < 2)
        {
            log.Add(1, null, null, "the file holds no tasks", "write the line 'vehicles capacity speed', then the depot as task 0 and one line per task");
            log.ThrowIfAny();
        }

        var (count, capacity, speed) = ReadHeader(lines[0], log);
        var rows = new List<(int Row, long Task, double[] Values)>();
        for (int i = 1; i < lines.Count; i++)
        {
            if (ReadRow(lines[i], rows.Count == 0, log) is { } values)
            {
                rows.Add((lines[i].Row, (long)values[0], values));
            }
        }

        log.ThrowIfAny();
        var indexOf = new Dictionary<long, int>();
        for (int i = 1; i < rows.Count; i++)
        {
            if (!indexOf.TryAdd(rows[i].Task, i - 1) || rows[i].Task == 0)
            {
                log.Add(rows[i].Row, Columns[0], Text(rows[i].Task), $"task number {rows[i].Task} appears twice", "give every task its own number");
            }
        }

        log.ThrowIfAny();
        var collectFrom = LinkPairs(rows, indexOf, log);
        log.ThrowIfAny();
        return Build(fileName, count, capacity, speed, rows, collectFrom);
    }

    private static (int Count, double Capacity, double Speed) ReadHeader(TextLine line, ProblemLog log)
    {
        const string Fix = "write the number of vehicles, their capacity and the speed, e.g. '25 200 1'";
        if (line.Tokens.Length != 3)
        {
            log.Add(line.Row, "vehicles capacity speed", line.Text.Trim(), $"the first line has {line.Tokens.Length} values, expected 3", Fix);
            return (0, 0, 1);
        }

        int count = 0;
        if (!Numbers.TryWhole(line.Tokens[0], out long n) || n < 1 || n > SolomonReader.MaxVehicles)
        {
            log.Add(line.Row, "vehicles", line.Tokens[0], "the number of vehicles is not a whole number from 1 to " + SolomonReader.MaxVehicles, Fix);
        }
        else
        {
            count = (int)n;
        }

        if (!Numbers.TryFinite(line.Tokens[1], out double capacity) || !Limits.BenchmarkQuantity.Contains(capacity))
        {
            log.Add(line.Row, "capacity", line.Tokens[1], "the capacity is not a number from 0 to 10^9", Fix);
        }

        if (!Numbers.TryFinite(line.Tokens[2], out double speed) || speed <= 0 || speed > 1e6)
        {
            log.Add(line.Row, "speed", line.Tokens[2], "the speed is not a number above 0 (distance per time unit)", Fix);
            speed = 1;
        }

        return (count, capacity, speed);
    }

    private static double[]? ReadRow(TextLine line, bool isDepot, ProblemLog log)
    {
        if (line.Tokens.Length != Columns.Length)
        {
            log.Add(line.Row, null, line.Text.Trim(), $"the task line has {line.Tokens.Length} values, expected {Columns.Length}", RowFix);
            return null;
        }

        var v = new double[Columns.Length];
        bool ok = true;
        for (int c = 0; c < Columns.Length; c++)
        {
            if (!Numbers.TryFinite(line.Tokens[c], out v[c]))
            {
                log.Add(line.Row, Columns[c], line.Tokens[c], "not a finite number", RowFix);
                ok = false;
            }
        }

        if (!ok)
        {
            return null;
        }

        foreach (int c in new[] { 0, 7, 8 })
        {
            if (v[c] < 0 || v[c] != Math.Floor(v[c]))
            {
                log.Add(line.Row, Columns[c], line.Tokens[c], "not a whole task number of at least 0", RowFix);
                ok = false;
            }
        }

        if (isDepot && ok && (v[0] != 0 || v[3] != 0))
        {
            log.Add(line.Row, Columns[0], line.Tokens[0], "the first task line must be the depot: task 0 with demand 0", "put the depot first, numbered 0");
            ok = false;
        }

        if (v[4] > v[5])
        {
            log.Add(line.Row, Columns[5], line.Tokens[5], $"the latest time is before the earliest {line.Tokens[4]}", "make the latest time at least the earliest");
            ok = false;
        }

        ok &= log.InRange(line.Row, Columns[1], line.Tokens[1], v[1], Limits.BenchmarkCoordinate, "the x coordinate");
        ok &= log.InRange(line.Row, Columns[2], line.Tokens[2], v[2], Limits.BenchmarkCoordinate, "the y coordinate");
        ok &= log.InRange(line.Row, Columns[3], line.Tokens[3], Math.Abs(v[3]), Limits.BenchmarkQuantity, "the demand");
        ok &= log.InRange(line.Row, Columns[4], line.Tokens[4], v[4], Limits.BenchmarkTime, "the earliest time");
        ok &= log.InRange(line.Row, Columns[5], line.Tokens[5], v[5], Limits.BenchmarkTime, "the latest time");
        ok &= log.InRange(line.Row, Columns[6], line.Tokens[6], v[6], Limits.BenchmarkTime, "the service time");
        return ok ? v : null;
    }

    /// <summary>Per stop, the stop index it collects from (deliveries), else -1; every link must be mutual and balanced.</summary>
    private static int[] LinkPairs(List<(int Row, long Task, double[] Values)> rows, Dictionary<long, int> indexOf, ProblemLog log)
    {
        var collectFrom = new int[rows.Count - 1];
        Array.Fill(collectFrom, -1);
        for (int i = 1; i < rows.Count; i++)
        {
            var (row, task, v) = rows[i];
            long pickup = (long)v[7];
            long delivery = (long)v[8];
            bool isPickup = delivery != 0;
            long partner = isPickup ? delivery : pickup;
            string column = isPickup ? Columns[8] : Columns[7];
            if ((pickup == 0) == (delivery == 0))
            {
                log.Add(row, Columns[7], Text(pickup), "a task must name either its delivery task (a pickup) or its pickup task (a delivery), not both or neither",
                    "write 0 in one of the last two columns and the partner task's number in the other");
                continue;
            }

            if (!indexOf.TryGetValue(partner, out int p))
            {
                log.Add(row, column, Text(partner), $"task {partner} is not in the file", "name a task of this file");
                continue;
            }

            var pv = rows[p + 1].Values;
            long back = (long)(isPickup ? pv[7] : pv[8]);
            if (back != task)
            {
                log.Add(row, column, Text(partner), $"task {partner} does not name task {task} back as its {(isPickup ? "pickup" : "delivery")}",
                    $"make task {partner}'s {(isPickup ? "pickup" : "delivery")} column {task}");
                continue;
            }

            if (isPickup && (v[3] < 0 || pv[3] != -v[3]))
            {
                log.Add(row, Columns[3], Text(v[3]), $"a pickup's demand must be positive and its delivery task {partner}'s the same amount negative (it is {Text(pv[3])})",
                    "write the amount as +q on the pickup task and -q on its delivery task");
                continue;
            }

            if (!isPickup)
            {
                collectFrom[i - 1] = p;
            }
        }

        return collectFrom;
    }

    private static Instance Build(string fileName, int count, double capacity, double speed, List<(int Row, long Task, double[] Values)> rows, int[] collectFrom)
    {
        var depot = rows[0].Values;
        int n = rows.Count - 1;
        var stops = new Stop[n];
        var x = new double[n + 1];
        var y = new double[n + 1];
        for (int i = 0; i < n; i++)
        {
            var v = rows[i + 1].Values;
            bool delivery = collectFrom[i] >= 0;
            stops[i] = new Stop
            {
                Id = Text(rows[i + 1].Task),
                X = v[1],
                Y = v[2],
                Demand = [delivery ? -v[3] : 0],
                Pickup = [delivery ? 0 : v[3]],
                CollectFrom = collectFrom[i],
                ServiceTime = v[6],
                Windows = [new TimeWindow(v[4], v[5])],
            };
            x[i] = v[1];
            y[i] = v[2];
        }

        x[n] = depot[1];
        y[n] = depot[2];
        var depots = new[] { new Depot { Id = "0", X = depot[1], Y = depot[2] } };
        var vehicles = BenchmarkFleet.Identical(count, capacity, depot[4], depot[5]);
        string name = Path.GetFileNameWithoutExtension(fileName);
        return new Instance(name, stops, depots, vehicles, ["demand"], [], RuleSet.AllHard, Objective.VehiclesThenDistance,
            TravelTable.Planar(x, y, roundToInteger: false, timePerDistance: 1.0 / speed), Units.Plain);
    }

    private static string Text(double value) => value.ToString(CultureInfo.InvariantCulture);
}
