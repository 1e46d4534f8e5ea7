namespace Anneal.Core.Model;

public enum Objective
{
    /// <summary>Money: fixed cost per vehicle used + distance and driver-time costs + soft-rule penalties.</summary>
    Cost,

    /// <summary>Total distance (benchmark convention), plus any soft-rule penalties.</summary>
    Distance,

    /// <summary>Fewest vehicles first, then least distance (hierarchical benchmark convention).</summary>
    VehiclesThenDistance,
}

public static class ObjectiveNames
{
    public static string ToText(this Objective objective) => objective switch
    {
        Objective.Cost => "cost",
        Objective.Distance => "distance",
        Objective.VehiclesThenDistance => "vehicles-then-distance",
        _ => throw new ArgumentOutOfRangeException(nameof(objective)),
    };

    public static bool TryParse(string? text, out Objective objective)
    {
        switch (text?.Trim().ToLowerInvariant())
        {
            case "cost": objective = Objective.Cost; return true;
            case "distance": objective = Objective.Distance; return true;
            case "vehicles-then-distance": objective = Objective.VehiclesThenDistance; return true;
            default: objective = Objective.Cost; return false;
        }
    }

    public const string Accepted = "cost, distance, vehicles-then-distance";
}
