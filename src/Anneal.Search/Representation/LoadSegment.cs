using System.Runtime.CompilerServices;

namespace Anneal.Search.Representation;

/// <summary>
/// The load data of a run of consecutive stops when stops also collect (returns to the depot, collect-and-deliver
/// pairs), per dimension (up to four): D, what the run needs loaded at the depot; P, what is on board after it when it
/// left with D (D less what it unloads plus what it collects); L, the largest load on board at any point of it (on
/// leaving with D and after each stop). Two runs concatenate in O(1): D = D1 + D2, P = P1 + P2,
/// L = max(L1 + D2, P1 + L2), since the first run carries the second's depot load and the second the first's end load.
/// This is the segment data for simultaneous delivery and pickup of Vidal et al. (2014, EJOR 234(3), the unified
/// hybrid genetic search; quoted from memory, not checked against the paper here); a pair's delivery is simply a stop
/// with D = 0 and P = -its amount. Exact whatever the order, so a broken pair still gets the evaluator's peak.
/// </summary>
public struct LoadSegment
{
    public double D0, D1, D2, D3;
    public double P0, P1, P2, P3;
    public double L0, L1, L2, L3;

    /// <summary>One stop: its depot load d, its end load d - demand + pickup, and the larger of the two.</summary>
    public static LoadSegment Node(ReadOnlySpan<double> depotLoad, ReadOnlySpan<double> endLoad)
    {
        var s = default(LoadSegment);
        s.D0 = At(depotLoad, 0);
        s.D1 = At(depotLoad, 1);
        s.D2 = At(depotLoad, 2);
        s.D3 = At(depotLoad, 3);
        s.P0 = At(endLoad, 0);
        s.P1 = At(endLoad, 1);
        s.P2 = At(endLoad, 2);
        s.P3 = At(endLoad, 3);
        s.L0 = Math.Max(s.D0, s.P0);
        s.L1 = Math.Max(s.D1, s.P1);
        s.L2 = Math.Max(s.D2, s.P2);
        s.L3 = Math.Max(s.D3, s.P3);
        return s;
    }

    /// <summary>Appends b to a in place.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static void Extend(ref LoadSegment a, in LoadSegment b)
    {
        a.L0 = double.MaxNative(a.L0 + b.D0, a.P0 + b.L0);
        a.L1 = double.MaxNative(a.L1 + b.D1, a.P1 + b.L1);
        a.L2 = double.MaxNative(a.L2 + b.D2, a.P2 + b.L2);
        a.L3 = double.MaxNative(a.L3 + b.D3, a.P3 + b.L3);
        a.D0 += b.D0;
        a.D1 += b.D1;
        a.D2 += b.D2;
        a.D3 += b.D3;
        a.P0 += b.P0;
        a.P1 += b.P1;
        a.P2 += b.P2;
        a.P3 += b.P3;
    }

    private static double At(ReadOnlySpan<double> values, int d) => d < values.Length ? values[d] : 0;
}
