namespace Anneal.Formats.Input.Csv;

/// <summary>What a job's parts are called in messages that point from one part to another ("use an id from depots.csv").</summary>
internal sealed record JobNames(string Stops, string Depots, string Vehicles, string Matrix)
{
    public static readonly JobNames Csv = new("stops.csv", "depots.csv", "vehicles.csv", "matrix.csv");

    public static readonly JobNames Workbook = new("the stops sheet", "the depots sheet", "the vehicles sheet", "the matrix sheet");
}
