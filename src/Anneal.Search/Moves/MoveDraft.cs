namespace Anneal.Search.Moves;

/// <summary>
/// A move described by what it builds: one or two new routes, plus at most one stop sent to the unserved pool
/// and at most one taken from it. Evaluation and application read the same description, so they cannot disagree.
/// </summary>
public struct MoveDraft
{
    public int RouteCount;
    public RouteDraft A;
    public RouteDraft B;

    /// <summary>Stop that leaves every route (drop move), or -1.</summary>
    public int Dropped;

    /// <summary>Unserved stop that joins a route, or -1.</summary>
    public int Inserted;

    public MoveKind Kind;

    public void Reset(MoveKind kind)
    {
        RouteCount = 0;
        Dropped = -1;
        Inserted = -1;
        Kind = kind;
    }
}
