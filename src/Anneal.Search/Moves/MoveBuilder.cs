using Anneal.Search.Representation;

namespace Anneal.Search.Moves;

/// <summary>
/// Describes each neighbourhood move as the routes it builds. A builder returns false when the move does not
/// apply (same route where two are needed, overlapping chains, a no-op).
/// </summary>
public static class MoveBuilder
{
    /// <summary>Move stop u (and the next chain − 1 stops of its route) to just after (or before) stop v.</summary>
    public static bool Relocate(SearchState s, ref MoveDraft m, int u, int v, bool after, int chain = 1)
    {
        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        if (ru < 0 || rv < 0 || u == v)
        {
            return false;
        }

        int pu = s.PositionOf(u), pv = s.PositionOf(v);
        int end = pu + chain - 1;
        if (end >= s.Length(ru))
        {
            return false;
        }

        // Insertion gap: the chain goes between positions gap-1 and gap of rv.
        int gap = after ? pv + 1 : pv;
        m.Reset(chain == 1 ? MoveKind.Relocate : MoveKind.RelocateChain);
        if (ru == rv)
        {
            if (gap >= pu && gap <= end + 1)
            {
                return false;
            }

            m.RouteCount = 1;
            m.A.Clear(ru);
            if (gap < pu)
            {
                m.A.Add(Piece.Range(ru, 0, gap - 1));
                m.A.Add(Piece.Range(ru, pu, end));
                m.A.Add(Piece.Range(ru, gap, pu - 1));
                m.A.Add(Piece.Range(ru, end + 1, s.Length(ru) - 1));
            }
            else
            {
                m.A.Add(Piece.Range(ru, 0, pu - 1));
                m.A.Add(Piece.Range(ru, end + 1, gap - 1));
                m.A.Add(Piece.Range(ru, pu, end));
                m.A.Add(Piece.Range(ru, gap, s.Length(ru) - 1));
            }

            return true;
        }

        m.RouteCount = 2;
        Without(s, ref m.A, ru, pu, end);
        m.B.Clear(rv);
        m.B.Add(Piece.Range(rv, 0, gap - 1));
        m.B.Add(Piece.Range(ru, pu, end));
        m.B.Add(Piece.Range(rv, gap, s.Length(rv) - 1));
        return true;
    }

    /// <summary>Move stop u alone onto an empty route.</summary>
    public static bool ToEmptyRoute(SearchState s, ref MoveDraft m, int u, int emptyRoute)
    {
        int ru = s.RouteOf(u);
        if (ru < 0 || s.Length(emptyRoute) != 0 || ru == emptyRoute)
        {
            return false;
        }

        int pu = s.PositionOf(u);
        m.Reset(MoveKind.Relocate);
        m.RouteCount = 2;
        Without(s, ref m.A, ru, pu, pu);
        m.B.Clear(emptyRoute);
        m.B.Add(Piece.Range(ru, pu, pu));
        return true;
    }

    /// <summary>Exchange segments of lengths a and b starting at u and at v (Swap when a = b = 1; CROSS, Taillard et al. 1997).</summary>
    public static bool Exchange(SearchState s, ref MoveDraft m, int u, int v, int a = 1, int b = 1)
    {
        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        if (ru < 0 || rv < 0 || u == v)
        {
            return false;
        }

        int pu = s.PositionOf(u), pv = s.PositionOf(v);
        if (pu + a > s.Length(ru) || pv + b > s.Length(rv))
        {
            return false;
        }

        m.Reset(a == 1 && b == 1 ? MoveKind.Swap : MoveKind.Cross);
        if (ru == rv)
        {
            if (a != 1 || b != 1)
            {
                return false;
            }

            int lo = Math.Min(pu, pv), hi = Math.Max(pu, pv);
            m.RouteCount = 1;
            m.A.Clear(ru);
            m.A.Add(Piece.Range(ru, 0, lo - 1));
            m.A.Add(Piece.Range(ru, hi, hi));
            m.A.Add(Piece.Range(ru, lo + 1, hi - 1));
            m.A.Add(Piece.Range(ru, lo, lo));
            m.A.Add(Piece.Range(ru, hi + 1, s.Length(ru) - 1));
            return true;
        }

        m.RouteCount = 2;
        m.A.Clear(ru);
        m.A.Add(Piece.Range(ru, 0, pu - 1));
        m.A.Add(Piece.Range(rv, pv, pv + b - 1));
        m.A.Add(Piece.Range(ru, pu + a, s.Length(ru) - 1));
        m.B.Clear(rv);
        m.B.Add(Piece.Range(rv, 0, pv - 1));
        m.B.Add(Piece.Range(ru, pu, pu + a - 1));
        m.B.Add(Piece.Range(rv, pv + b, s.Length(rv) - 1));
        return true;
    }

    /// <summary>
    /// 2-opt* (Potvin &amp; Rousseau 1995) between two routes: after=true joins u to v's successor and v to u's
    /// successor; after=false joins u's predecessor to v and v's predecessor to u.
    /// </summary>
    public static bool TwoOptStar(SearchState s, ref MoveDraft m, int u, int v, bool after)
    {
        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        if (ru < 0 || rv < 0 || ru == rv)
        {
            return false;
        }

        int pu = s.PositionOf(u), pv = s.PositionOf(v);
        int cu = after ? pu : pu - 1;
        int cv = after ? pv : pv - 1;
        bool noTails = cu == s.Length(ru) - 1 && cv == s.Length(rv) - 1;
        bool noHeads = cu < 0 && cv < 0;
        if (noTails || noHeads)
        {
            return false; // nothing changes hands (or two whole routes swap vehicles)
        }

        m.Reset(MoveKind.TwoOptStar);
        m.RouteCount = 2;
        m.A.Clear(ru);
        m.A.Add(Piece.Range(ru, 0, cu));
        m.A.Add(Piece.Range(rv, cv + 1, s.Length(rv) - 1));
        m.B.Clear(rv);
        m.B.Add(Piece.Range(rv, 0, cv));
        m.B.Add(Piece.Range(ru, cu + 1, s.Length(ru) - 1));
        return true;
    }

    /// <summary>2-opt within one route: reverse the stops strictly after u up to and including v.</summary>
    public static bool TwoOpt(SearchState s, ref MoveDraft m, int u, int v)
    {
        int ru = s.RouteOf(u);
        if (ru < 0 || ru != s.RouteOf(v))
        {
            return false;
        }

        int pu = s.PositionOf(u), pv = s.PositionOf(v);
        int lo = Math.Min(pu, pv), hi = Math.Max(pu, pv);
        if (hi - lo < 2)
        {
            return false;
        }

        m.Reset(MoveKind.TwoOpt);
        m.RouteCount = 1;
        m.A.Clear(ru);
        m.A.Add(Piece.Range(ru, 0, lo));
        m.A.Add(Piece.Backwards(ru, lo + 1, hi));
        m.A.Add(Piece.Range(ru, hi + 1, s.Length(ru) - 1));
        return true;
    }

    /// <summary>Leave stop u unserved.</summary>
    public static bool Drop(SearchState s, ref MoveDraft m, int u)
    {
        int ru = s.RouteOf(u);
        if (ru < 0)
        {
            return false;
        }

        int pu = s.PositionOf(u);
        m.Reset(MoveKind.Drop);
        m.RouteCount = 1;
        Without(s, ref m.A, ru, pu, pu);
        m.Dropped = u;
        return true;
    }

    /// <summary>Put unserved stop u just after (or before) v, or onto route <paramref name="emptyRoute"/> when v &lt; 0.</summary>
    public static bool Insert(SearchState s, ref MoveDraft m, int u, int v, bool after, int emptyRoute = -1)
    {
        if (s.RouteOf(u) >= 0)
        {
            return false;
        }

        m.Reset(MoveKind.Insert);
        m.RouteCount = 1;
        m.Inserted = u;
        if (v < 0)
        {
            if (emptyRoute < 0 || s.Length(emptyRoute) != 0)
            {
                return false;
            }

            m.A.Clear(emptyRoute);
            m.A.Add(Piece.Single(u));
            return true;
        }

        int rv = s.RouteOf(v);
        if (rv < 0)
        {
            return false;
        }

        int gap = after ? s.PositionOf(v) + 1 : s.PositionOf(v);
        m.A.Clear(rv);
        m.A.Add(Piece.Range(rv, 0, gap - 1));
        m.A.Add(Piece.Single(u));
        m.A.Add(Piece.Range(rv, gap, s.Length(rv) - 1));
        return true;
    }

    /// <summary>The route as it is, less positions from..to.</summary>
    private static void Without(SearchState s, ref RouteDraft draft, int route, int from, int to)
    {
        draft.Clear(route);
        draft.Add(Piece.Range(route, 0, from - 1));
        draft.Add(Piece.Range(route, to + 1, s.Length(route) - 1));
    }
}
