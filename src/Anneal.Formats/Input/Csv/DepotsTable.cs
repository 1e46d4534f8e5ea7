using Anneal.Core.Model;

namespace Anneal.Formats.Input.Csv;

/// <summary>depots.csv: where vehicles start and end.</summary>
internal static class DepotsTable
{
    public const string FileName = "depots.csv";

    public static (List<Depot> Depots, IdRegistry Ids, CoordinateSystem System) Read(CsvTable table, ProblemList problems)
    {
        HeaderCheck.Check(table, ["id", "name", "address", .. Coordinates.Columns], [], problems);
        bool hasId = HeaderCheck.Require(table, "id", "a unique name per depot", problems);
        var system = Coordinates.Detect(table, problems);
        var depots = new List<Depot>();
        var ids = new IdRegistry();
        foreach (var row in table.Rows)
        {
            var cells = new Cells(table, row, problems);
            var id = cells.Required("id", "a unique depot id") ?? $"(row {row.Line})";
            if (hasId)
            {
                ids.Add(id, depots.Count, cells, "depot");
            }

            var (x, y) = Coordinates.Read(cells, system);
            depots.Add(new Depot { Id = id, Name = cells.Text("name"), Address = cells.Text("address"), X = x, Y = y });
        }

        if (table.Rows.Count == 0)
        {
            problems.Add(table, null, null, null, "no depots", "add at least one depot line under the header");
        }

        return (depots, ids, system);
    }
}
