namespace Anneal.Search.Moves;

/// <summary>The neighbourhoods (Osman 1993; Potvin &amp; Rousseau 1995; Taillard et al. 1997).</summary>
public enum MoveKind : byte
{
    Relocate,
    RelocateChain,
    Swap,
    TwoOpt,
    TwoOptStar,
    Cross,
    Drop,
    Insert,

    /// <summary>A collect-and-deliver pair moved to another route, both ends at once.</summary>
    PairRelocate,

    /// <summary>Two pairs on two routes swapped, end for end.</summary>
    PairExchange,
}
