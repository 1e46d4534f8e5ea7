namespace Anneal.Formats.Output;

/// <summary>
/// What a plan does not promise. Kept in one place so the README, summary.json and every printed report say the same.
/// </summary>
public static class Cautions
{
    public static IReadOnlyList<string> All { get; } =
    [
        "Driving-time and rest rules, vehicle size and weight limits and road restrictions follow local regulations; Anneal does not check them unless they are modelled in the job.",
        "Travel times computed from coordinates are estimates (straight-line or great-circle distance × detour factor at an average speed); a matrix.csv from a road-network router is better.",
        "A dispatcher checks the plan before it is driven.",
        "Breaks planned under driving rules are not proof of compliance: the driver's recording equipment (tachograph, logging device) and local law govern.",
    ];

    /// <summary>The caution a breach of driving rules is shown with.</summary>
    public static string DrivingRules => All[3];
}
