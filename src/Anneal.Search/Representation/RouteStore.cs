using Anneal.Search.Moves;

namespace Anneal.Search.Representation;

/// <summary>
/// The routes as sequences: one per vehicle (possibly empty), each stop's route and position, a version per route
/// that changes with it, and the pool of unserved stops. Knows nothing of costs.
/// </summary>
public sealed class RouteStore
{
    // Shared with the segment cache and the state's front, which read them in hot loops (one load less per read
    // than going through the store); none of these arrays, nor the outer one of Stops, ever changes identity.
    internal readonly int[][] Stops;
    internal readonly int[] Lengths;
    internal readonly int[] RouteOfStop;
    internal readonly int[] PositionOfStop;

    private readonly int[] _version;
    private readonly int[] _unserved;
    private readonly int[] _unservedIndex;
    private int _unservedCount;

    public RouteStore(int stopCount, int routeCount)
    {
        Stops = new int[routeCount][];
        Lengths = new int[routeCount];
        for (int r = 0; r < routeCount; r++)
        {
            Stops[r] = new int[8];
        }

        RouteOfStop = new int[stopCount];
        PositionOfStop = new int[stopCount];
        _version = new int[routeCount];
        _unserved = new int[stopCount];
        _unservedIndex = new int[stopCount];
    }

    public int RouteCount => Lengths.Length;

    public int RouteOf(int stop) => RouteOfStop[stop];

    public int PositionOf(int stop) => PositionOfStop[stop];

    public int Length(int route) => Lengths[route];

    public int StopAt(int route, int position) => Stops[route][position];

    public ReadOnlySpan<int> Route(int route) => Stops[route].AsSpan(0, Lengths[route]);

    /// <summary>Changes every time the route changes; lets a search cache move evaluations per route pair.</summary>
    public int Version(int route) => _version[route];

    public int UnservedCount => _unservedCount;

    public int UnservedAt(int index) => _unserved[index];

    /// <summary>Marks a stop as on no route (the caller takes it off its route).</summary>
    internal void SetUnrouted(int stop, int marker = -1) => RouteOfStop[stop] = marker;

    /// <summary>Adds a stop to the unserved pool, at its end.</summary>
    internal void AddUnserved(int stop)
    {
        _unservedIndex[stop] = _unservedCount;
        _unserved[_unservedCount++] = stop;
    }

    /// <summary>Takes a stop out of the pool; the pool's last stop takes its place.</summary>
    internal void RemoveUnserved(int stop)
    {
        int idx = _unservedIndex[stop];
        int last = _unserved[--_unservedCount];
        _unserved[idx] = last;
        _unservedIndex[last] = idx;
    }

    /// <summary>Writes the draft's stops, in order, into <paramref name="target"/>; returns the count.</summary>
    public int Materialise(ref RouteDraft draft, int[] target)
    {
        int count = 0;
        for (int k = 0; k < draft.Count; k++)
        {
            ref Piece p = ref draft.Pieces[k];
            if (p.Route < 0)
            {
                target[count++] = p.Stop;
                continue;
            }

            var stops = Stops[p.Route];
            if (!p.Reversed)
            {
                for (int i = p.From; i <= p.To; i++)
                {
                    target[count++] = stops[i];
                }
            }
            else
            {
                for (int i = p.To; i >= p.From; i--)
                {
                    target[count++] = stops[i];
                }
            }
        }

        return count;
    }

    /// <summary>Gives the route exactly these stops; positions and the version follow. The pool is the caller's business.</summary>
    internal void Store(int route, ReadOnlySpan<int> source)
    {
        int count = source.Length;
        if (Stops[route].Length < count)
        {
            Array.Resize(ref Stops[route], Math.Max(count, Stops[route].Length * 2));
        }

        source.CopyTo(Stops[route]);
        Lengths[route] = count;
        Renumber(route);
    }

    private void Renumber(int route)
    {
        _version[route]++;
        var stops = Stops[route];
        int len = Lengths[route];
        for (int k = 0; k < len; k++)
        {
            RouteOfStop[stops[k]] = route;
            PositionOfStop[stops[k]] = k;
        }
    }
}
