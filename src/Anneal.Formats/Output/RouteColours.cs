namespace Anneal.Formats.Output;

/// <summary>
/// The route colours every output shares (the map, the schedule chart, the report's route sheets and routes.geojson): twelve clearly distinct hues of our own,
/// ordered so that neighbours differ in hue and lightness, with no red (red marks lateness) and no black (the depots).
/// The pictures draw a thirteenth route and on dashed, the twenty-fifth and on dotted.
/// </summary>
public static class RouteColours
{
    public static IReadOnlyList<string> Hex { get; } =
    [
        "#1f5fa8", "#e08a00", "#2e9e5b", "#7b3fb0", "#00a3b4", "#8c6d00",
        "#d45aa8", "#7f7f7f", "#6fae2a", "#b8b000", "#7a5230", "#5fb7e8",
    ];

    public static string Of(int route) => Hex[route % Hex.Count];
}
