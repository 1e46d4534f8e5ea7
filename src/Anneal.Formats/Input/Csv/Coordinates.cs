namespace Anneal.Formats.Input.Csv;

/// <summary>The x/y or lat/lon columns of stops.csv and depots.csv.</summary>
internal static class Coordinates
{
    public static readonly string[] Columns = ["x", "y", "lat", "lon"];

    public static CoordinateSystem Detect(CsvTable table, ProblemList problems)
    {
        bool x = table.Has("x"), y = table.Has("y"), lat = table.Has("lat"), lon = table.Has("lon");
        if ((x || y) && (lat || lon))
        {
            problems.Add(table, 1, null, null, "the file mixes planar x/y and lat/lon columns",
                $"use either x and y (planar km) or lat and lon (degrees), in {table.Names.Stops} and {table.Names.Depots} alike");
            return CoordinateSystem.None;
        }

        if (x || y)
        {
            bool ok = HeaderCheck.Require(table, "x", "planar x in km", problems) & HeaderCheck.Require(table, "y", "planar y in km", problems);
            return ok ? CoordinateSystem.Planar : CoordinateSystem.None;
        }

        if (lat || lon)
        {
            bool ok = HeaderCheck.Require(table, "lat", "latitude in degrees", problems) & HeaderCheck.Require(table, "lon", "longitude in degrees", problems);
            return ok ? CoordinateSystem.LatLon : CoordinateSystem.None;
        }

        problems.Add(table, 1, "x, y or lat, lon", null, "no coordinate columns", "add columns x and y (planar km) or lat and lon (degrees)");
        return CoordinateSystem.None;
    }

    /// <summary>Reads one row's location as plotting coordinates: (x, y), or (lon, lat) for degrees.</summary>
    public static (double X, double Y) Read(Cells cells, CoordinateSystem system)
    {
        switch (system)
        {
            case CoordinateSystem.Planar:
                return (Zero(cells.Number("x", double.NaN, Limits.PlanarKm, "the x coordinate in km")),
                        Zero(cells.Number("y", double.NaN, Limits.PlanarKm, "the y coordinate in km")));
            case CoordinateSystem.LatLon:
                double lat = Zero(cells.Number("lat", double.NaN, false, "the latitude in degrees"));
                double lon = Zero(cells.Number("lon", double.NaN, false, "the longitude in degrees"));
                if (lat is < -90 or > 90)
                {
                    cells.Report("lat", cells.Text("lat"), "latitude outside -90..90", "give the latitude in degrees (north positive); check that lat and lon are not swapped");
                    lat = 0;
                }

                if (lon is < -180 or > 180)
                {
                    cells.Report("lon", cells.Text("lon"), "longitude outside -180..180", "give the longitude in degrees (east positive)");
                    lon = 0;
                }

                return (lon, lat);
            default:
                return (0, 0);
        }
    }

    private static double Zero(double v) => double.IsNaN(v) ? 0 : v;
}
