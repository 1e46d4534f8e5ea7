using System.Runtime.CompilerServices;

namespace Anneal.Search.Representation;

/// <summary>
/// Summary of a run of consecutive stops for O(1) concatenation (Savelsbergh 1985; Vidal et al. 2013, C&amp;OR 40(1)):
/// duration D (travel + service + waiting, time warp included), time warp TW, earliest and latest start E and L
/// that achieve them, distance, load per dimension (up to four) and the union of required skills.
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
    public ulong Skills;

    public static Segment Node(int location, double service, double open, double close, double load0, double load1, double load2, double load3, ulong skills) => new()
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
        Skills = skills,
    };

    /// <summary>A depot visit with no service; Count 0 so it does not count as a stop.</summary>
    public static Segment Depot(int location, double open, double close) => new()
    {
        First = location,
        Last = location,
        Earliest = Math.Max(-Far, open),
        Latest = Math.Min(Far, close),
    };

    /// <summary>a followed by b, with the arc between them.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Segment Concat(in Segment a, in Segment b, double travelTime, double travelDistance)
    {
        double delta = a.Duration - a.TimeWarp + travelTime;
        double waitGain = Math.Max(b.Earliest - delta - a.Latest, 0);
        double warpGain = Math.Max(a.Earliest + delta - b.Latest, 0);
        Segment s;
        s.First = a.First;
        s.Last = b.Last;
        s.Count = a.Count + b.Count;
        s.Distance = a.Distance + b.Distance + travelDistance;
        s.Duration = a.Duration + b.Duration + travelTime + waitGain;
        s.TimeWarp = a.TimeWarp + b.TimeWarp + warpGain;
        s.Earliest = Math.Max(b.Earliest - delta, a.Earliest) - waitGain;
        s.Latest = Math.Min(b.Latest - delta, a.Latest) + warpGain;
        s.Load0 = a.Load0 + b.Load0;
        s.Load1 = a.Load1 + b.Load1;
        s.Load2 = a.Load2 + b.Load2;
        s.Load3 = a.Load3 + b.Load3;
        s.Skills = a.Skills | b.Skills;
        return s;
    }
}
