namespace Anneal.Core.Screening;

/// <summary>The requirements a vehicle must meet to serve a stop on a route of its own.</summary>
internal enum ScreenCheck
{
    Capacity,
    Equipment,
    Window,
    ShiftEnd,
    MaxDuration,
}
