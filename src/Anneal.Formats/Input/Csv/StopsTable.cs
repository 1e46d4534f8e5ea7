using Anneal.Core.Model;

namespace Anneal.Formats.Input.Csv;

/// <summary>stops.csv: the places to serve, their demand per dimension, windows, the equipment they need and whether they may be skipped.</summary>
internal static class StopsTable
{
    public const string FileName = "stops.csv";

    private const string DemandPrefix = "demand_";

    private const string PickupPrefix = "pickup_";

    private static readonly string[] Known = ["id", "name", "address", .. Coordinates.Columns, "service", "windows", "needs", "optional", "penalty", PairLinks.Column];

    /// <param name="dimensions">The job's dimensions from vehicles.csv; null when vehicles.csv could not be read.</param>
    /// <param name="vehicleEquipment">Equipment some vehicle carries; null when vehicles.csv could not be read.</param>
    public static (List<Stop> Stops, IdRegistry Ids, CoordinateSystem System) Read(
        CsvTable table, IReadOnlyList<string>? dimensions, IReadOnlySet<string>? vehicleEquipment, EquipmentIndex equipment, ProblemList problems)
    {
        HeaderCheck.Check(table, Known, [DemandPrefix, PickupPrefix], problems);
        bool hasId = HeaderCheck.Require(table, "id", "a unique name per stop", problems);
        var system = Coordinates.Detect(table, problems);
        var demandColumn = DemandColumns(table, DemandPrefix, dimensions ?? [], dimensions is not null, problems);
        var pickupColumn = DemandColumns(table, PickupPrefix, dimensions ?? [], dimensions is not null, problems);
        var links = new List<(CsvRow Row, int Stop, string Partner)>();
        var stops = new List<Stop>();
        var ids = new IdRegistry();
        foreach (var row in table.Rows)
        {
            var cells = new Cells(table, row, problems);
            var id = cells.Required("id", "a unique stop id") ?? $"(row {row.Line})";
            if (hasId)
            {
                ids.Add(id, stops.Count, cells, "stop");
            }

            var (x, y) = Coordinates.Read(cells, system);
            var demand = new double[dimensions?.Count ?? 0];
            foreach (var (column, d) in demandColumn)
            {
                // Unmatched columns are still checked, so every bad cell is reported in one pass.
                double value = cells.Number(column, 0, Limits.Quantity, "the demand");
                if (d >= 0)
                {
                    demand[d] = value;
                }
            }

            var pickup = new double[dimensions?.Count ?? 0];
            foreach (var (column, d) in pickupColumn)
            {
                double value = cells.Number(column, 0, Limits.Quantity, "the amount collected");
                if (d >= 0)
                {
                    pickup[d] = value;
                }
            }

            if (cells.Text(PairLinks.Column) is { Length: > 0 } partner)
            {
                links.Add((row, stops.Count, partner));
            }

            ulong needs = 0;
            foreach (var item in cells.List("needs"))
            {
                if (vehicleEquipment is not null && !vehicleEquipment.Contains(item))
                {
                    var near = Closest.Find(item, vehicleEquipment);
                    cells.Report("needs", item, "no vehicle carries this equipment",
                        near is not null ? $"did you mean '{near}'? Or add it to a vehicle's equipment in {table.Names.Vehicles}" : $"add it to a vehicle's equipment in {table.Names.Vehicles}, or remove it from the stop");
                }

                needs |= equipment.Bit(item, cells, "needs");
            }

            stops.Add(new Stop
            {
                Id = id,
                Name = cells.Text("name"),
                Address = cells.Text("address"),
                X = x,
                Y = y,
                Demand = demand,
                Pickup = pickup,
                ServiceTime = cells.Duration("service", 0, Limits.Service, "the service time"),
                Windows = WindowText.Read(cells, "windows"),
                Needs = needs,
                Optional = cells.Flag("optional"),
                UnservedPenalty = cells.Text("penalty").Length == 0 ? double.NaN : cells.Number("penalty", double.NaN, Limits.Price, "the price of leaving the stop unserved"),
            });
        }

        if (table.Rows.Count == 0)
        {
            problems.Add(table, null, null, null, "no stops", "add at least one stop line under the header");
        }

        PairLinks.Resolve(table, stops, ids, links, dimensions ?? [], problems);
        return (stops, ids, system);
    }

    /// <summary>Each demand (or pickup) column with its dimension index (-1 when vehicles.csv has no such capacity).</summary>
    private static List<(string Column, int Dimension)> DemandColumns(CsvTable table, string prefix, IReadOnlyList<string> dimensions, bool check, ProblemList problems)
    {
        var columns = new List<(string, int)>();
        foreach (var (index, name) in HeaderCheck.Family(table, prefix))
        {
            int d = -1;
            for (int k = 0; k < dimensions.Count; k++)
            {
                if (string.Equals(dimensions[k], name, StringComparison.OrdinalIgnoreCase))
                {
                    d = k;
                }
            }

            columns.Add((table.Header[index], d));
            if (d < 0 && check)
            {
                var near = Closest.Find(name, dimensions);
                problems.Add(table, 1, table.Header[index], null, $"no vehicle capacity for dimension '{name}' ({table.Names.Vehicles} has no capacity_{name} column)",
                    near is not null ? $"did you mean {prefix}{near}? Or add capacity_{name} to {table.Names.Vehicles}" : $"add a capacity_{name} column to {table.Names.Vehicles}");
            }
        }

        return columns;
    }
}
