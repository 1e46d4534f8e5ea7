namespace Anneal.Bounds.Vehicles;

/// <summary>At least this many vehicles serve the required stops in any plan that keeps the hard rules, and why.</summary>
public sealed record VehicleCount(int Vehicles, string Reason);
