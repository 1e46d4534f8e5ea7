using System.Globalization;
using Anneal.Bounds.Relaxation;
using Anneal.Bounds.Simple;
using Anneal.Bounds.Vehicles;

namespace Anneal.OrTools.Bounds;

/// <summary>
/// The bound's stages in order, each valid on its own, each offering its result to the keeper as soon as it has one:
/// the fewest vehicles with their fixed costs and each stop's cheapest arcs, then LP relaxations while time lasts.
/// </summary>
internal static class BoundStages
{
    /// <summary>Above this many stops column generation is not tried (the pricing network grows with the square).</summary>
    public const int ColumnLimit = 1500;

    /// <summary>Neighbourhood size of the ng-routes: 8 is the usual choice (Baldacci, Mingozzi &amp; Roberti 2011).</summary>
    public const int NgSize = 8;

    /// <summary>Runs the stages until <paramref name="stop"/> fires; returns the vehicle count and notes for the user.</summary>
    public static VehicleCount Run(RelaxedInstance relaxed, BoundKeeper keeper, List<string> notes, CancellationToken stop)
    {
        var vehicles = VehicleBound.Compute(relaxed);
        notes.Add(string.Create(CultureInfo.InvariantCulture, $"at least {vehicles.Vehicles} vehicle(s): {vehicles.Reason}"));
        keeper.Offer(ArcShareBound.Compute(relaxed, vehicles, stop), "vehicles and cheapest arcs");
        if (relaxed.StopCount <= ColumnLimit && !stop.IsCancellationRequested)
        {
            var generation = new ColumnGeneration(relaxed, vehicles.Vehicles, NgSize);
            generation.Run(keeper, stop);
            notes.Add(string.Create(CultureInfo.InvariantCulture,
                $"column generation: {generation.Rounds} rounds, {generation.Columns} routes, {(generation.Converged ? "converged" : "stopped before converging")}{(generation.Failure is { } why ? ": " + why : string.Empty)}"));
        }

        return vehicles;
    }
}
