using Anneal.Bounds.Relaxation;

namespace Anneal.Bounds.Pricing;

/// <summary>
/// One kind of vehicle's routes as a graph for the pricing loops, in flat arrays: nodes 0..n-1 are the stops, n the
/// start depot, n + 1 the end depot. Arc costs include the service at the arc's tail (see
/// <see cref="RelaxedInstance.ArcCost"/>); arc times are service at the tail plus travel. Arcs that no feasible route
/// can use (the load of both ends exceeds a capacity, or the head cannot be reached in time even leaving the tail
/// at its earliest) are left out. Each stop's ng-neighbourhood (Baldacci, Mingozzi &amp; Roberti 2011) is itself and
/// its nearest stops by arc cost.
/// </summary>
public sealed class PricingNetwork
{
    public RouteKind Kind { get; }

    public int N { get; }

    public int Dimensions { get; }

    /// <summary>Row-major (n + 2)²: arc cost, arc time.</summary>
    public double[] Cost { get; }

    public double[] Time { get; }

    /// <summary>Demand per stop and dimension (row-major n × dims) and capacity per dimension.</summary>
    public double[] Demand { get; }

    public double[] Capacity { get; }

    /// <summary>Successors of each node, flat: node i's are Successors[SuccessorStart[i] .. SuccessorStart[i + 1]).</summary>
    public int[] SuccessorStart { get; }

    public int[] Successors { get; }

    /// <summary>Neighbourhood of stop i: Neighbours[i * NgSize + p], position 0 being i itself.</summary>
    public int[] Neighbours { get; }

    public int NgSize { get; }

    /// <summary>Position of stop u in the neighbourhood of stop j, or −1: PositionIn[j * n + u].</summary>
    public sbyte[] PositionIn { get; }

    public ServiceStart Starts { get; }

    /// <summary>True when time can make a route infeasible, so the labels carry it.</summary>
    public bool TimeMatters => Kind.TimeMatters;

    /// <summary>True when no capacity or time bounds a route: then a route has at most n visits (an elementary route does).</summary>
    public bool NeedsVisitLimit { get; }

    public bool[] Serves { get; }

    public PricingNetwork(RelaxedInstance relaxed, RouteKind kind, int ngSize)
    {
        Kind = kind;
        Starts = relaxed.Starts;
        var instance = relaxed.Instance;
        int n = relaxed.StopCount;
        N = n;
        int dims = instance.DimensionCount;
        Dimensions = dims;
        Serves = kind.Serves;
        int m = n + 2;
        Cost = new double[m * m];
        Time = new double[m * m];
        var travel = instance.Travel;
        for (int a = 0; a < m; a++)
        {
            int from = Location(a);
            for (int b = 0; b < m; b++)
            {
                int to = Location(b);
                Cost[(a * m) + b] = relaxed.ArcCost(kind, from, to);
                Time[(a * m) + b] = relaxed.Service(from) + travel.Duration(from, to);
            }
        }

        Demand = new double[n * dims];
        bool positive = true;
        for (int i = 0; i < n; i++)
        {
            double any = 0;
            for (int d = 0; d < dims; d++)
            {
                Demand[(i * dims) + d] = instance.Demand(i, d);
                if (!double.IsPositiveInfinity(kind.Capacity[d]))
                {
                    any += instance.Demand(i, d);
                }
            }

            positive &= !kind.Serves[i] || any > 0;
        }

        Capacity = (double[])kind.Capacity.Clone();
        NeedsVisitLimit = !kind.TimeMatters && !positive;
        (SuccessorStart, Successors) = Arcs(relaxed, kind, n, m);
        NgSize = Math.Clamp(ngSize, 1, 64);
        (Neighbours, PositionIn) = Neighbourhoods(kind, n, m, NgSize);

        int Location(int node) => node < n ? node : node == n ? kind.Start : kind.End;
    }

    public int StartNode => N;

    public int EndNode => N + 1;

    public double ArcCost(int a, int b) => Cost[(a * (N + 2)) + b];

    public double ArcTime(int a, int b) => Time[(a * (N + 2)) + b];

    private (int[] Start, int[] List) Arcs(RelaxedInstance relaxed, RouteKind kind, int n, int m)
    {
        var earliest = new double[n];
        for (int i = 0; i < n; i++)
        {
            earliest[i] = kind.Serves[i] && kind.TimeMatters ? Starts.At(i, kind.ShiftStart + relaxed.Paths!.Between(kind.Start, i)) : double.NaN;
        }

        var start = new int[m + 1];
        var list = new List<int>();
        for (int a = 0; a < m; a++)
        {
            start[a] = list.Count;
            if (a == n + 1 || (a < n && !kind.Serves[a]))
            {
                continue;
            }

            for (int b = 0; b < n; b++)
            {
                if (b != a && kind.Serves[b] && Usable(relaxed, kind, a, b, earliest, n, m))
                {
                    list.Add(b);
                }
            }
        }

        start[m] = list.Count;
        return (start, list.ToArray());
    }

    private bool Usable(RelaxedInstance relaxed, RouteKind kind, int a, int b, double[] earliest, int n, int m)
    {
        if (a == n)
        {
            return true;
        }

        for (int d = 0; d < Dimensions; d++)
        {
            if (Demand[(a * Dimensions) + d] + Demand[(b * Dimensions) + d] > kind.Capacity[d])
            {
                return false;
            }
        }

        if (!kind.TimeMatters)
        {
            return true;
        }

        double arrival = earliest[a] + Time[(a * m) + b];
        double begin = Starts.At(b, arrival);
        return !double.IsNaN(begin) && begin + relaxed.Service(b) + relaxed.Paths!.Between(b, kind.End) <= kind.LatestReturn;
    }

    private (int[] Neighbours, sbyte[] PositionIn) Neighbourhoods(RouteKind kind, int n, int m, int size)
    {
        var neighbours = new int[n * size];
        var position = new sbyte[n * n];
        Array.Fill(position, (sbyte)-1);
        var order = new int[n];
        var key = new double[n];
        for (int i = 0; i < n; i++)
        {
            int count = 0;
            for (int j = 0; j < n; j++)
            {
                if (j != i && kind.Serves[j])
                {
                    order[count] = j;
                    key[count] = Math.Min(Cost[(i * m) + j], Cost[(j * m) + i]);
                    count++;
                }
            }

            Array.Sort(key, order, 0, count);
            neighbours[i * size] = i;
            int filled = 1;
            for (int k = 0; k < count && filled < size; k++)
            {
                neighbours[(i * size) + filled++] = order[k];
            }

            for (; filled < size; filled++)
            {
                neighbours[(i * size) + filled] = -1;
            }
        }

        for (int j = 0; j < n; j++)
        {
            for (int p = 0; p < size; p++)
            {
                int u = neighbours[(j * size) + p];
                if (u >= 0)
                {
                    position[(j * n) + u] = (sbyte)p;
                }
            }
        }

        return (neighbours, position);
    }
}
