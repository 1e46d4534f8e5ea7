namespace Anneal.Formats.Input.Csv;

/// <summary>matrix.csv: distance (km) and duration (minutes) per ordered pair of locations, e.g. from a road router.</summary>
internal static class MatrixTable
{
    public const string FileName = "matrix.csv";

    /// <summary>How many individual unknown ids or missing pairs are listed before the rest are only counted.</summary>
    private const int Shown = 5;

    /// <param name="locations">Location index of each stop and depot id (stops first, then depots).</param>
    /// <param name="names">Id of each location index, for messages.</param>
    public static (double[] Distance, double[] Duration) Read(
        CsvTable table, IReadOnlyDictionary<string, int> locations, IReadOnlyList<string> names, ProblemList problems)
    {
        HeaderCheck.Check(table, ["from", "to", "distance", "duration"], [], problems);
        bool ok = HeaderCheck.Require(table, "from", "the id of the stop or depot the arc starts at", problems)
            & HeaderCheck.Require(table, "to", "the id of the stop or depot the arc ends at", problems)
            & HeaderCheck.Require(table, "distance", "the road distance in km", problems)
            & HeaderCheck.Require(table, "duration", "the travel time in minutes or H:MM", problems);

        int n = names.Count;
        var distance = new double[n * n];
        var duration = new double[n * n];
        var line = new int[n * n]; // 0 = not given
        var unknown = new List<(Cells Cells, string Column, string Id)>();
        foreach (var row in table.Rows)
        {
            var cells = new Cells(table, row, problems);
            var from = cells.Required("from", "a stop or depot id");
            var to = cells.Required("to", "a stop or depot id");
            double dist = cells.Number("distance", double.NaN, Limits.TripKm, "the distance in km");
            double time = TimeOrNaN(cells);
            int a = Locate(from, "from", cells, locations, unknown);
            int b = Locate(to, "to", cells, locations, unknown);
            if (a < 0 || b < 0 || double.IsNaN(dist) || double.IsNaN(time))
            {
                continue;
            }

            int k = (a * n) + b;
            if (line[k] != 0)
            {
                cells.Report("from", $"{from},{to}", $"the pair is given twice (first on row {line[k]})", "keep one line per ordered pair");
                continue;
            }

            line[k] = row.Line;
            distance[k] = dist;
            duration[k] = time;
        }

        problems.AddCapped(unknown, Shown,
            u => u.Cells.Report(u.Column, u.Id, "unknown stop or depot id", Suggest(u.Id, locations.Keys, table.Names)),
            rest => problems.Add(table, null, null, null, $"{rest} more lines name unknown ids", $"use ids from {table.Names.Stops} and {table.Names.Depots}"));
        if (ok)
        {
            FillReverse(table, n, distance, duration, line, names, problems);
        }

        return (distance, duration);
    }

    private static double TimeOrNaN(Cells cells)
    {
        if (!cells.Has("duration"))
        {
            return double.NaN;
        }

        if (cells.Text("duration").Length == 0)
        {
            cells.Report("duration", string.Empty, "'duration' is empty", "give the travel time in minutes or H:MM");
            return double.NaN;
        }

        return cells.Duration("duration", double.NaN, Limits.TripMinutes, "the travel time");
    }

    private static int Locate(string? id, string column, Cells cells, IReadOnlyDictionary<string, int> locations, List<(Cells, string, string)> unknown)
    {
        if (id is null)
        {
            return -1;
        }

        if (locations.TryGetValue(id, out int index))
        {
            return index;
        }

        unknown.Add((cells, column, id));
        return -1;
    }

    // A missing (b,a) is taken equal to (a,b), with a warning that lists them; pairs missing both ways are problems.
    private static void FillReverse(CsvTable file, int n, double[] distance, double[] duration, int[] line, IReadOnlyList<string> names, ProblemList problems)
    {
        var missing = new List<(int A, int B)>();
        var oneWay = new List<(int From, int To)>();
        for (int a = 0; a < n; a++)
        {
            for (int b = a + 1; b < n; b++)
            {
                int ab = (a * n) + b, ba = (b * n) + a;
                if (line[ab] == 0 && line[ba] != 0)
                {
                    distance[ab] = distance[ba];
                    duration[ab] = duration[ba];
                    oneWay.Add((b, a));
                }
                else if (line[ba] == 0 && line[ab] != 0)
                {
                    distance[ba] = distance[ab];
                    duration[ba] = duration[ab];
                    oneWay.Add((a, b));
                }
                else if (line[ab] == 0)
                {
                    missing.Add((a, b));
                }
            }
        }

        problems.AddCapped(missing, Shown,
            m => problems.Add(file, null, "from, to", $"{names[m.A]},{names[m.B]}", "the pair is missing (neither direction is given)", "add a line with from, to, distance and duration for it"),
            rest => problems.Add(file, null, null, null, $"{rest} more pairs are missing", "give every pair of distinct stops and depots at least in one direction"));
        if (oneWay.Count > 0)
        {
            var shown = new List<string>();
            for (int i = 0; i < oneWay.Count && i < Shown; i++)
            {
                shown.Add($"{Quote.Cap(names[oneWay[i].From])} -> {Quote.Cap(names[oneWay[i].To])}");
            }

            problems.Warnings.Add($"{file.File}: {oneWay.Count} pair(s) are given in one direction only ({string.Join(", ", shown)}{(oneWay.Count > Shown ? ", ..." : string.Empty)}); "
                + "the way back is taken to be the same distance and duration. Give both directions where roads differ (one-way streets, turns).");
        }
    }

    private static string Suggest(string id, IEnumerable<string> known, JobNames names)
    {
        var near = Closest.Find(id, known);
        var use = $"ids from {names.Stops} and {names.Depots}";
        return near is not null ? $"did you mean '{near}'? Use {use}" : "use " + use;
    }
}
