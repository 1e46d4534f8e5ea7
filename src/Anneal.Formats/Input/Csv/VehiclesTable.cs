using Anneal.Core.Model;

namespace Anneal.Formats.Input.Csv;

/// <summary>vehicles.csv: vehicle types with a count, their capacities (which define the job's dimensions) and shifts.</summary>
internal static class VehiclesTable
{
    public const string FileName = "vehicles.csv";

    private const string CapacityPrefix = "capacity_";

    private static readonly string[] Known =
        ["id", "count", "depot", "end_depot", "shift_start", "shift_end", "max_duration", "fixed_cost", "cost_per_km", "cost_per_hour", "equipment", "available_from", "available_until", "driving_rules"];

    /// <summary>Largest count accepted, so a typo cannot ask for millions of vehicle records.</summary>
    private const int MaxCount = 10_000;

    public static (List<Vehicle> Vehicles, List<string> Dimensions) Read(
        CsvTable table, IdRegistry depots, int depotCount, EquipmentIndex equipment, ProblemList problems, DrivingBook? driving = null)
    {
        HeaderCheck.Check(table, Known, [CapacityPrefix], problems);
        bool hasId = HeaderCheck.Require(table, "id", "a unique name per vehicle type", problems);
        var family = HeaderCheck.Family(table, CapacityPrefix);
        var dimensions = new List<string>();
        foreach (var (_, name) in family)
        {
            dimensions.Add(name);
        }

        if (family.Count == 0)
        {
            problems.Add(table, 1, "capacity_<dim>", null, "no capacity column", "add at least one capacity column, e.g. capacity_kg");
        }

        if (depotCount > 1 && !table.Has("depot"))
        {
            problems.Add(table, 1, "depot", null, $"{table.Names.Depots} has more than one depot but {table.Names.Vehicles} has no 'depot' column", "add a 'depot' column naming each vehicle's start depot");
        }

        var vehicles = new List<Vehicle>();
        var rawIds = new IdRegistry();
        var expandedIds = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var row in table.Rows)
        {
            var cells = new Cells(table, row, problems);
            var id = cells.Required("id", "a unique vehicle id") ?? $"(row {row.Line})";
            if (hasId)
            {
                rawIds.Add(id, vehicles.Count, cells, "vehicle");
            }

            int count = Count(cells);
            int start = Depot(cells, "depot", depots, depotCount, 0);
            int end = cells.Text("end_depot").Length > 0 ? Depot(cells, "end_depot", depots, depotCount, start) : start;

            var capacity = new double[family.Count];
            for (int d = 0; d < family.Count; d++)
            {
                var column = table.Header[family[d].Index];
                double c = cells.Number(column, double.NaN, Limits.Quantity, "the capacity in " + family[d].Name);
                capacity[d] = double.IsNaN(c) ? 0 : c;
            }

            double shiftStart = cells.Time("shift_start", 0);
            double shiftEnd = cells.Time("shift_end", 24 * 60);
            if (shiftStart > shiftEnd)
            {
                cells.Report("shift_end", cells.Text("shift_end"), $"the shift ends before it starts ({cells.Text("shift_start")})", "give shift_start no later than shift_end; a night shift may end after 24:00, e.g. 26:30");
            }

            // A vehicle that joins late or leaves early (a breakdown, a driver gone home) narrows its shift; a re-plan
            // takes a vehicle out once its available_until is past --now.
            shiftStart = Math.Max(shiftStart, cells.Time("available_from", shiftStart));
            shiftEnd = Math.Max(shiftStart, Math.Min(shiftEnd, cells.Time("available_until", shiftEnd)));

            ulong equipmentBits = 0;
            foreach (var item in cells.List("equipment"))
            {
                equipmentBits |= equipment.Bit(item, cells, "equipment");
            }

            var template = new Vehicle
            {
                Id = id,
                StartDepot = start,
                EndDepot = end,
                Capacity = capacity,
                ShiftStart = shiftStart,
                ShiftEnd = shiftEnd,
                MaxDuration = cells.Duration("max_duration", double.PositiveInfinity, Limits.MaxDuration, "the longest route duration"),
                FixedCost = Cost(cells, "fixed_cost", "the fixed cost of using the vehicle"),
                CostPerDistance = Cost(cells, "cost_per_km", "the cost per km"),
                CostPerHour = Cost(cells, "cost_per_hour", "the cost per hour"),
                Equipment = equipmentBits,
                DrivingRules = Driving(cells, driving ?? DrivingBook.PresetsOnly),
            };
            for (int k = 1; k <= count; k++)
            {
                var v = count == 1 ? template : template with { Id = $"{id}-{k}", Capacity = (double[])capacity.Clone() };
                if (!expandedIds.TryAdd(v.Id, row.Line) && count > 1)
                {
                    cells.Report("id", id, $"the expanded id '{v.Id}' clashes with a vehicle on row {expandedIds[v.Id]}", "rename one of the vehicles");
                }

                vehicles.Add(v);
            }
        }

        if (table.Rows.Count == 0)
        {
            problems.Add(table, null, null, null, "no vehicles", "add at least one vehicle line under the header");
        }

        return (vehicles, dimensions);
    }

    /// <summary>The vehicle's driving-rule set: the one its cell names, the job's default when the cell is empty, none for "none".</summary>
    private static Core.DrivingRules.DrivingRuleSet? Driving(Cells cells, DrivingBook book)
    {
        var text = cells.Text("driving_rules");
        if (text.Length == 0)
        {
            return book.Default;
        }

        if (book.Sets.TryGetValue(text, out var set))
        {
            return set;
        }

        if (string.Equals(text, DrivingBook.None, StringComparison.OrdinalIgnoreCase))
        {
            return null;
        }

        var near = Closest.Find(text, book.Names());
        cells.Report("driving_rules", text, "unknown driving-rule set",
            (near is not null ? $"did you mean '{near}'? " : string.Empty) + "use one of " + string.Join(", ", book.Names()) + ", or define the set in settings.json under drivingRules.sets");
        return null;
    }

    private static int Count(Cells cells)
    {
        var text = cells.Text("count");
        if (text.Length == 0)
        {
            return 1;
        }

        if (!int.TryParse(text, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int count) || count < 1 || count > MaxCount)
        {
            cells.Report("count", text, "not a whole number from 1 to " + MaxCount, "give how many identical vehicles of this type there are, e.g. 3");
            return 1;
        }

        return count;
    }

    private static int Depot(Cells cells, string column, IdRegistry depots, int depotCount, int fallback)
    {
        var text = cells.Text(column);
        if (text.Length == 0)
        {
            if (depotCount > 1 && column == "depot" && cells.Has(column))
            {
                cells.Report(column, text, $"no start depot given while {cells.Names.Depots} has several", $"name the start depot (an id from {cells.Names.Depots})");
            }

            return fallback;
        }

        if (depots.TryGet(text, out int index))
        {
            return index;
        }

        if (depots.Count > 0)
        {
            var near = Closest.Find(text, depots.Ids);
            cells.Report(column, text, "unknown depot id", near is not null ? $"did you mean '{near}'? Use an id from {cells.Names.Depots}" : $"use an id from {cells.Names.Depots}");
        }

        return fallback;
    }

    private static double Cost(Cells cells, string column, string meaning)
    {
        double v = cells.Number(column, 0, Limits.Price, meaning);
        return double.IsNaN(v) ? 0 : v;
    }
}
