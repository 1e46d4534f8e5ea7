using System.Runtime.CompilerServices;

namespace Anneal.Search.Representation;

/// <summary>
/// Summary of a run of consecutive stops for O(1) concatenation (Savelsbergh 1985; Vidal et al. 2013, C&amp;OR 40(1)):
/// duration D (travel + service + waiting, time warp included), time warp TW, earliest and latest start E and L
/// that achieve them, distance, load per dimension (up to four) and the union of the equipment the stops need.
/// </summary>
public struct Segment
{
    /// <summary>Window bounds are clamped to this so that open-ended windows never produce inf − inf.</summary>
    public const double Far = 1e15;

    public int First;
    public int Last;
    public int Count;
    public double Distance;
    public double Duration;
    public double TimeWarp;
    public double Earliest;
    public double Latest;
    public double Load0;
    public double Load1;
    public double Load2;
    public double Load3;
    public ulong Needs;

    public static Segment Node(int location, double service, double open, double close, double load0, double load1, double load2, double load3, ulong needs) => new()
    {
        First = location,
        Last = location,
        Count = 1,
        Duration = service,
        Earliest = Math.Max(-Far, open),
        Latest = Math.Min(Far, close),
        Load0 = load0,
        Load1 = load1,
        Load2 = load2,
        Load3 = load3,
        Needs = needs,
    };

    /// <summary>A depot visit with no service; Count 0 so it does not count as a stop.</summary>
    public static Segment Depot(int location, double open, double close) => new()
    {
        First = location,
        Last = location,
        Earliest = Math.Max(-Far, open),
        Latest = Math.Min(Far, close),
    };

    /// <summary>
    /// Appends b to a in place: a followed by b, with the arc between them. Native min/max are safe because every
    /// value here is finite (windows are clamped to <see cref="Far"/>).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static void Extend(ref Segment a, in Segment b, double travelTime, double travelDistance)
    {
        double delta = a.Duration - a.TimeWarp + travelTime;
        double waitGain = double.MaxNative(b.Earliest - delta - a.Latest, 0);
        double warpGain = double.MaxNative(a.Earliest + delta - b.Latest, 0);
        a.Last = b.Last;
        a.Count += b.Count;
        a.Distance += b.Distance + travelDistance;
        a.Duration += b.Duration + travelTime + waitGain;
        a.TimeWarp += b.TimeWarp + warpGain;
        a.Earliest = double.MaxNative(b.Earliest - delta, a.Earliest) - waitGain;
        a.Latest = double.MinNative(b.Latest - delta, a.Latest) + warpGain;
        a.Load0 += b.Load0;
        a.Load1 += b.Load1;
        a.Load2 += b.Load2;
        a.Load3 += b.Load3;
        a.Needs |= b.Needs;
    }
}
