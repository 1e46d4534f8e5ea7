using System.Runtime.CompilerServices;

namespace Anneal.Search.Moves;

[InlineArray(5)]
public struct PieceList
{
    private Piece _first;
}

/// <summary>The new stop sequence of one route, as up to five pieces; no allocation.</summary>
public struct RouteDraft
{
    public int Route;
    public int Count;
    public PieceList Pieces;

    public void Clear(int route)
    {
        Route = route;
        Count = 0;
    }

    public void Add(in Piece piece)
    {
        if (piece.Length > 0)
        {
            Pieces[Count++] = piece;
        }
    }

    public readonly int StopCount
    {
        get
        {
            int total = 0;
            for (int k = 0; k < Count; k++)
            {
                total += Pieces[k].Length;
            }

            return total;
        }
    }
}
