using Anneal.Core.Model;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// stops.csv's <c>collect_from</c> column: on a delivery stop, the id of the stop where its goods are collected. Every
/// mistake is named with its row and both ids: an unknown id, a stop collecting from itself, a chain (the collection is
/// itself a delivery of a pair), two deliveries from one collection, amounts that differ, one end optional and not the other.
/// </summary>
internal static class PairLinks
{
    public const string Column = "collect_from";

    public static void Resolve(CsvTable table, List<Stop> stops, IdRegistry ids, List<(CsvRow Row, int Stop, string Partner)> links, IReadOnlyList<string> dimensions, ProblemList problems)
    {
        var deliveryOf = new Dictionary<int, string>();
        var linked = new int[stops.Count];
        Array.Fill(linked, -1);
        foreach (var (row, d, partner) in links)
        {
            if (!ids.TryGet(partner, out int c))
            {
                var near = Closest.Find(partner, stops.Select(s => s.Id));
                Report(problems, table, row, partner, $"no stop has id '{partner}'", near is not null ? $"did you mean '{near}'? The column names the stop where this stop's delivery is collected" : "give the id of the stop where this stop's delivery is collected, or leave the cell empty");
                continue;
            }

            if (c == d)
            {
                Report(problems, table, row, partner, "a stop cannot collect from itself", "give the id of another stop, where the goods are collected, or leave the cell empty");
                continue;
            }

            if (deliveryOf.TryGetValue(c, out string? other))
            {
                Report(problems, table, row, partner, $"stop {other} already collects from {partner}; a collection stop serves one delivery", $"give each delivery its own collection stop (add a row for a second collection at the same place)");
                continue;
            }

            deliveryOf[c] = stops[d].Id;
            linked[d] = c;
        }

        foreach (var (row, d, partner) in links)
        {
            int c = linked[d];
            if (c < 0)
            {
                continue;
            }

            if (linked[c] >= 0)
            {
                Report(problems, table, row, partner, $"stop {partner} is itself the delivery of a pair (it collects from {stops[linked[c]].Id}); pairs do not chain",
                    $"collect directly where the goods are: give {stops[linked[c]].Id}, or split the journey into two pairs with their own stops");
                linked[d] = -1;
                continue;
            }

            for (int k = 0; k < dimensions.Count; k++)
            {
                double delivered = stops[d].Demand[k];
                double collected = stops[c].Pickup[k];
                if (delivered != collected)
                {
                    Report(problems, table, row, partner, $"stop {stops[d].Id} delivers {delivered} {dimensions[k]} (demand_{dimensions[k]}), but {partner} collects {collected} (pickup_{dimensions[k]})",
                        $"make pickup_{dimensions[k]} of {partner} equal demand_{dimensions[k]} of {stops[d].Id}: what is collected for a delivery is what it receives");
                    linked[d] = -1;
                    break;
                }
            }

            if (linked[d] >= 0 && stops[d].Optional != stops[c].Optional)
            {
                Report(problems, table, row, partner, $"one stop of the pair {partner}>{stops[d].Id} is optional and the other is not",
                    "make both optional (the pair is served whole or left out whole) or neither");
                linked[d] = -1;
            }
        }

        for (int d = 0; d < stops.Count; d++)
        {
            if (linked[d] >= 0)
            {
                stops[d] = stops[d] with { CollectFrom = linked[d] };
            }
        }
    }

    private static void Report(ProblemList problems, CsvTable table, CsvRow row, string value, string problem, string fix) =>
        problems.Add(table, row.Line, Column, value, problem, fix);
}
