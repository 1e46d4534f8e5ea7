using Anneal.Search.Representation;

namespace Anneal.Search.Moves;

/// <summary>
/// Moves that keep each collect-and-deliver pair on one route, collection first (the pair shift and pair exchange
/// of Nanry &amp; Barnes 2000, Transportation Research B 34(2), quoted from memory): both ends change route
/// together. Each builder returns false when the stop is in no whole pair on a route, or the move does not apply.
/// </summary>
public static class PairMoveBuilder
{
    /// <summary>The pair of stop u as (collection, delivery) positions on its route, when both are there in order.</summary>
    public static bool Ends(SearchState s, int u, out int collection, out int delivery)
    {
        var instance = s.Instance;
        int partner = instance.Partner(u);
        collection = instance.IsCollection(u) ? u : partner;
        delivery = instance.IsCollection(u) ? partner : u;
        return partner >= 0 && s.RouteOf(u) >= 0 && s.RouteOf(u) == s.RouteOf(partner)
            && s.PositionOf(collection) < s.PositionOf(delivery);
    }

    /// <summary>
    /// Moves u's pair onto another route: its collection before position <paramref name="gapC"/> of that route and
    /// its delivery before position <paramref name="gapD"/> (gapC ≤ gapD, both within 0..length).
    /// </summary>
    public static bool Relocate(SearchState s, ref MoveDraft m, int u, int target, int gapC, int gapD)
    {
        if (!Ends(s, u, out int c, out int d) || target == s.RouteOf(u) || gapC > gapD || gapD > s.Length(target))
        {
            return false;
        }

        int ru = s.RouteOf(u), pc = s.PositionOf(c), pd = s.PositionOf(d);
        m.Reset(MoveKind.PairRelocate);
        m.RouteCount = 2;
        Without(s, ref m.A, ru, pc, pd);
        Into(s, ref m.B, target, Piece.Range(ru, pc, pc), Piece.Range(ru, pd, pd), gapC, gapD);
        return true;
    }

    /// <summary>Moves u's pair to v's route, u just after (or before) v and its partner next to u on the side its order needs.</summary>
    public static bool Beside(SearchState s, ref MoveDraft m, int u, int v, bool after)
    {
        int rv = s.RouteOf(v);
        if (rv < 0)
        {
            return false;
        }

        int gap = after ? s.PositionOf(v) + 1 : s.PositionOf(v);
        return Relocate(s, ref m, u, rv, gap, gap);
    }

    /// <summary>Swaps the pairs of u and v between their two routes, each end taking the other pair's end's place.</summary>
    public static bool Exchange(SearchState s, ref MoveDraft m, int u, int v)
    {
        if (!Ends(s, u, out int c1, out int d1) || !Ends(s, v, out int c2, out int d2) || s.RouteOf(u) == s.RouteOf(v))
        {
            return false;
        }

        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        int pc1 = s.PositionOf(c1), pd1 = s.PositionOf(d1), pc2 = s.PositionOf(c2), pd2 = s.PositionOf(d2);
        m.Reset(MoveKind.PairExchange);
        m.RouteCount = 2;
        Replace(s, ref m.A, ru, pc1, pd1, Piece.Range(rv, pc2, pc2), Piece.Range(rv, pd2, pd2));
        Replace(s, ref m.B, rv, pc2, pd2, Piece.Range(ru, pc1, pc1), Piece.Range(ru, pd1, pd1));
        return true;
    }

    /// <summary>Route <paramref name="route"/> with the collection piece before gapC and the delivery piece before gapD.</summary>
    public static void Into(SearchState s, ref RouteDraft draft, int route, in Piece collection, in Piece delivery, int gapC, int gapD)
    {
        draft.Clear(route);
        draft.Add(Piece.Range(route, 0, gapC - 1));
        draft.Add(collection);
        draft.Add(Piece.Range(route, gapC, gapD - 1));
        draft.Add(delivery);
        draft.Add(Piece.Range(route, gapD, s.Length(route) - 1));
    }

    private static void Without(SearchState s, ref RouteDraft draft, int route, int first, int second)
    {
        draft.Clear(route);
        draft.Add(Piece.Range(route, 0, first - 1));
        draft.Add(Piece.Range(route, first + 1, second - 1));
        draft.Add(Piece.Range(route, second + 1, s.Length(route) - 1));
    }

    private static void Replace(SearchState s, ref RouteDraft draft, int route, int first, int second, in Piece atFirst, in Piece atSecond)
    {
        draft.Clear(route);
        draft.Add(Piece.Range(route, 0, first - 1));
        draft.Add(atFirst);
        draft.Add(Piece.Range(route, first + 1, second - 1));
        draft.Add(atSecond);
        draft.Add(Piece.Range(route, second + 1, s.Length(route) - 1));
    }
}
