namespace Anneal.Formats.Input.Text;

/// <summary>What a scan of a CVRPLIB file found, before it is checked and turned into an instance.</summary>
internal sealed class CvrplibFile
{
    public Dictionary<string, (int Row, string Value)> Header { get; } = new(StringComparer.Ordinal);
    public HashSet<string> Sections { get; } = new(StringComparer.Ordinal);
    public Dictionary<long, (int Row, double X, double Y)> Coords { get; } = [];
    public Dictionary<long, (int Row, double Demand)> Demands { get; } = [];
    public List<(int Row, long Node)> Depots { get; } = [];
    public bool DepotsClosed { get; set; }
}

/// <summary>The checked specification values of a CVRPLIB file.</summary>
internal sealed class CvrplibSpecification
{
    public string? Name { get; set; }
    public int Dimension { get; set; }
    public double Capacity { get; set; }
    public int? Vehicles { get; set; }
}
