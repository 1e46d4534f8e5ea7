namespace Anneal.Search.Moves;

/// <summary>
/// Part of a route being built by a move: positions From..To (inclusive) of an existing route, forwards or
/// reversed, or a single stop taken from the unserved pool (Route = -1, Stop = the stop).
/// </summary>
public struct Piece
{
    public int Route;
    public int From;
    public int To;
    public bool Reversed;
    public int Stop;

    public readonly int Length => Route < 0 ? 1 : (To >= From ? To - From + 1 : 0);

    public static Piece Range(int route, int from, int to) => new() { Route = route, From = from, To = to, Stop = -1 };

    public static Piece Backwards(int route, int from, int to) => new() { Route = route, From = from, To = to, Reversed = true, Stop = -1 };

    public static Piece Single(int stop) => new() { Route = -1, From = 0, To = 0, Stop = stop };
}
