using ScottPlot;

namespace Anneal.Reports.Plots;

/// <summary>The colours every picture shares, so a solver or a state looks the same in each.</summary>
public static class Palette
{
    // Twenty distinguishable hues (the Category20 scheme of d3, as shipped with ScottPlot).
    private static readonly Color[] Routes = new ScottPlot.Palettes.Category20().Colors;
    private static readonly Color[] Solvers = new ScottPlot.Palettes.Category10().Colors;

    public static Color Late { get; } = Color.FromHex("#d62728");
    public static Color Unserved { get; } = Color.FromHex("#111111");
    public static Color Depot { get; } = Color.FromHex("#222222");
    public static Color Driving { get; } = Color.FromHex("#7f9fbf");
    public static Color Waiting { get; } = Color.FromHex("#f2d27c");
    public static Color Service { get; } = Color.FromHex("#4c9a5b");
    public static Color Window { get; } = Color.FromHex("#555555");
    public static Color Bound { get; } = Color.FromHex("#6a3d9a");

    public static Color Route(int k) => Routes[k % Routes.Length];

    public static Color Solver(int k) => Solvers[k % Solvers.Length];
}
