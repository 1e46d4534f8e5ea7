using Anneal.Search.Moves;
using Anneal.Search.Representation;

namespace Anneal.Search.Tabu;

/// <summary>One of the moves tried for a stop u and a candidate neighbour v.</summary>
/// <param name="After">For a relocation or 2-opt*: at v's far side (after v) rather than its near side.</param>
internal readonly record struct PairMove(MoveKind Kind, bool After);

/// <summary>
/// The moves tabu search tries per (u, v), by slot: five between two routes, the same five slots within one route,
/// two for an unserved u; and the two moves of a stop on its own (onto an empty route, or out of every route).
/// </summary>
internal static class PairMoves
{
    public const int Slots = 5;

    /// <summary>u and v on two routes.</summary>
    public static readonly PairMove[] Between =
    [
        new(MoveKind.Relocate, After: true),
        new(MoveKind.Relocate, After: false),
        new(MoveKind.Swap, After: false),
        new(MoveKind.TwoOptStar, After: true),
        new(MoveKind.TwoOptStar, After: false),
    ];

    /// <summary>u and v on one route: the last two slots become a 2-opt and a relocation of two stops.</summary>
    public static readonly PairMove[] Within =
    [
        new(MoveKind.Relocate, After: true),
        new(MoveKind.Relocate, After: false),
        new(MoveKind.Swap, After: false),
        new(MoveKind.TwoOpt, After: false),
        new(MoveKind.RelocateChain, After: true),
    ];

    /// <summary>An unserved u goes in after or before v; the other slots do not apply.</summary>
    public static readonly PairMove[] Unserved =
    [
        new(MoveKind.Insert, After: true),
        new(MoveKind.Insert, After: false),
    ];

    /// <summary>A stop alone: onto an empty route (an unserved stop: into it), or left unserved.</summary>
    public static readonly MoveKind[] Solo = [MoveKind.Relocate, MoveKind.Drop];

    /// <summary>The slot's move for u and v where they are now.</summary>
    public static bool TryGet(int ru, int rv, int slot, out PairMove move)
    {
        var table = ru < 0 ? Unserved : ru == rv ? Within : Between;
        move = slot < table.Length ? table[slot] : default;
        return slot < table.Length;
    }

    /// <summary>Drafts the slot's move; false when it does not apply.</summary>
    public static bool Build(SearchState s, ref MoveDraft move, int u, int v, int slot)
    {
        int ru = s.RouteOf(u), rv = s.RouteOf(v);
        if (!TryGet(ru, rv, slot, out var pair))
        {
            return false;
        }

        if (ru != rv && ru >= 0 && s.Instance.HasPairs && (pair.Kind is MoveKind.Relocate or MoveKind.Swap) && PairMoveBuilder.Ends(s, u, out _, out _))
        {
            // One end of a whole pair alone on another route would break it: the pair moves, or two pairs swap.
            return pair.Kind == MoveKind.Relocate ? PairMoveBuilder.Beside(s, ref move, u, v, pair.After) : PairMoveBuilder.Exchange(s, ref move, u, v);
        }

        return pair.Kind switch
        {
            MoveKind.Insert => rv >= 0 && MoveBuilder.Insert(s, ref move, u, v, pair.After),
            MoveKind.Relocate => MoveBuilder.Relocate(s, ref move, u, v, pair.After),
            MoveKind.Swap => MoveBuilder.Exchange(s, ref move, u, v),
            MoveKind.TwoOptStar => MoveBuilder.TwoOptStar(s, ref move, u, v, pair.After),
            MoveKind.TwoOpt => MoveBuilder.TwoOpt(s, ref move, u, v),
            _ => MoveBuilder.Relocate(s, ref move, u, v, pair.After, chain: 2),
        };
    }
}
