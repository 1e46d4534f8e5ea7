namespace Anneal.Formats.Output;

/// <summary>
/// The route colours every output shares (the pictures and routes.geojson): twelve clearly distinct hues of our own,
/// ordered so that neighbours differ in hue and lightness, with no red (red marks lateness).
/// </summary>
public static class RouteColours
{
    public static IReadOnlyList<string> Hex { get; } =
    [
        "#1f5fa8", "#e08a00", "#2e9e5b", "#7b3fb0", "#00a3b4", "#8c6d00",
        "#d45aa8", "#4a4a4a", "#6fae2a", "#2c3f8f", "#b86b3c", "#5fb7e8",
    ];

    public static string Of(int route) => Hex[route % Hex.Count];
}
