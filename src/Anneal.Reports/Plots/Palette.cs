using Anneal.Formats.Output;
using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>The colours every picture shares, so a solver or a state looks the same in each.</summary>
public static class Palette
{
    // The route hues shared with routes.geojson and the report (no red: red is lateness).
    private static readonly Color[] Routes = RouteColours.Hex.Select(Color.FromHex).ToArray();
    private static readonly Color[] Solvers = new ScottPlot.Palettes.Category10().Colors;

    public static Color Late { get; } = Color.FromHex("#d62728");
    public static Color Unserved { get; } = Color.FromHex("#111111");
    public static Color Depot { get; } = Color.FromHex("#222222");
    public static Color Driving { get; } = Color.FromHex("#7f9fbf");
    public static Color Waiting { get; } = Color.FromHex("#f2d27c");
    public static Color Service { get; } = Color.FromHex("#4c9a5b");
    public static Color Window { get; } = Color.FromHex("#555555");

    /// <summary>A driver's break: a light lavender, not a route hue and not the red of lateness.</summary>
    public static Color Break { get; } = Color.FromHex(BreakHex);

    public const string BreakHex = "#c6b6e6";
    public static Color Bound { get; } = Color.FromHex("#6a3d9a");

    public static Color Route(int k) => Routes[k % Routes.Length];

    /// <summary>Solid for the first round of hues, then dashed and dotted, so route 13 is not taken for route 1.</summary>
    public static LinePattern RoutePattern(int k) => (k / Routes.Length % 3) switch
    {
        0 => LinePattern.Solid,
        1 => LinePattern.Dashed,
        _ => LinePattern.Dotted,
    };

    public static Color Solver(int k) => Solvers[k % Solvers.Length];
}
