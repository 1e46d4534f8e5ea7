namespace Anneal.Bounds.Pricing;

/// <summary>
/// The pricing problem of column generation for vehicle routing: the least reduced cost of a route, by a labelling
/// algorithm for the resource-constrained shortest path (Desrochers, Desrosiers &amp; Solomon 1992, Operations
/// Research 40(2):342-354) over ng-routes (Baldacci, Mingozzi &amp; Roberti 2011, Operations Research 59(5):1269-1283):
/// a route may not return to a stop while that stop is still in its memory, the memory being kept only for stops in
/// the current stop's neighbourhood. Every elementary route is an ng-route, so the least reduced cost over ng-routes is
/// at most the least over routes that a plan can drive, which is what the Lagrangian bound needs.
/// <para>
/// A label is a partial route from the depot: its node, reduced cost, start of service, load per dimension, memory
/// (bits over the node's neighbourhood) and, when nothing else bounds a route, the number of visits. Labels are
/// extended in order of time (or load, or visits), and one label dominates another at the same node when it is no
/// worse in every resource and its memory is a subset (then every extension of the other is matched at no higher
/// cost), which keeps the run exact. The heuristic mode ignores memories in dominance and caps the labels per node:
/// it finds good columns fast but proves nothing. Labels live in flat arrays reused between runs; no allocation per label.
/// </para>
/// </summary>
public sealed class NgLabeling
{
    private const double NegativeEnough = -1e-9;

    private int[] _node = new int[1024];
    private double[] _cost = new double[1024];
    private double[] _time = new double[1024];
    private double[] _order = new double[1024];
    private double[] _load = new double[1024];
    private ulong[] _mem = new ulong[1024];
    private int[] _parent = new int[1024];
    private int[] _visits = new int[1024];
    private bool[] _dead = new bool[1024];
    private int _count;
    private int[][] _atNode = [];
    private int[] _atCount = [];
    private readonly PriorityQueue<int, double> _queue = new();
    private readonly CompletionBound _completion = new();

    /// <summary>Most labels one exact run may create before it gives up (incomplete).</summary>
    public int MaxLabels { get; init; } = 3_000_000;

    /// <summary>Labels kept per node in heuristic mode.</summary>
    public int HeuristicPerNode { get; init; } = 24;

    /// <param name="dual">Dual price of each stop's row (subtracted at each visit).</param>
    /// <param name="routeConstant">Reduced cost every route pays once: the fixed cost less the duals of the rows every route enters.</param>
    public PricingResult Price(PricingNetwork net, double[] dual, double routeConstant, bool exact, int maxColumns, CancellationToken cancel)
    {
        int n = net.N;
        int dims = net.Dimensions;
        Prepare(n, dims);
        var best = new ColumnPool(maxColumns);
        _completion.Compute(net, dual, cancel);
        double minClose = double.PositiveInfinity;
        bool complete = exact;
        var kind = net.Kind;
        int start = Add(net.StartNode, routeConstant, kind.ShiftStart, 0, 0, -1, 0, dims);
        _queue.Enqueue(start, 0);
        long pops = 0;
        while (_queue.TryDequeue(out int label, out _))
        {
            if (_dead[label])
            {
                continue;
            }

            if ((++pops & 1023) == 0 && cancel.IsCancellationRequested)
            {
                complete = false;
                break;
            }

            int i = _node[label];
            if (i < n)
            {
                double close = _cost[label] + net.ArcCost(i, net.EndNode);
                if (close < minClose)
                {
                    minClose = close;
                }

                if (close < NegativeEnough)
                {
                    best.Offer(close, label);
                }
            }

            if (_count >= MaxLabels)
            {
                complete = false;
                continue;
            }

            Extend(net, label, dual, exact);
        }

        _queue.Clear();
        var routes = new List<int[]>();
        foreach (int label in best.Labels())
        {
            routes.Add(Route(label));
        }

        return new PricingResult(minClose, complete, routes, _count);
    }

    private void Extend(PricingNetwork net, int label, double[] dual, bool exact)
    {
        int n = net.N;
        int dims = net.Dimensions;
        int i = _node[label];
        int ng = net.NgSize;
        bool timed = net.TimeMatters;
        var succ = net.Successors;
        int end = net.SuccessorStart[i + 1];
        double latest = net.Kind.LatestReturn;
        ulong mem = _mem[label];
        for (int s = net.SuccessorStart[i]; s < end; s++)
        {
            int j = succ[s];
            if (i < n)
            {
                int p = net.PositionIn[(i * n) + j];
                if (p >= 0 && (mem & (1UL << p)) != 0)
                {
                    continue;
                }
            }

            bool fits = true;
            for (int d = 0; d < dims; d++)
            {
                if (_load[(label * dims) + d] + net.Demand[(j * dims) + d] > net.Capacity[d])
                {
                    fits = false;
                    break;
                }
            }

            if (!fits)
            {
                continue;
            }

            double time = 0;
            if (timed)
            {
                time = net.Starts.At(j, _time[label] + net.ArcTime(i, j));
                if (double.IsNaN(time) || time + net.ArcTime(j, net.EndNode) > latest)
                {
                    continue;
                }
            }

            int visits = _visits[label] + 1;
            if (net.NeedsVisitLimit && visits > n)
            {
                continue;
            }

            ulong memory = 1UL;
            if (i < n)
            {
                for (ulong bits = mem; bits != 0; bits &= bits - 1)
                {
                    int b = System.Numerics.BitOperations.TrailingZeroCount(bits);
                    int u = net.Neighbours[(i * ng) + b];
                    int q = net.PositionIn[(j * n) + u];
                    if (q >= 0)
                    {
                        memory |= 1UL << q;
                    }
                }
            }

            double cost = _cost[label] + net.ArcCost(i, j) - dual[j];
            Insert(net, j, cost, time, memory, label, visits, exact);
        }
    }

    /// <summary>Adds the label at node j unless a label there dominates it; removes those it dominates.</summary>
    private void Insert(PricingNetwork net, int j, double cost, double time, ulong memory, int parent, int visits, bool exact)
    {
        int dims = net.Dimensions;
        bool timed = net.TimeMatters;
        bool counted = net.NeedsVisitLimit;
        var list = _atNode[j];
        int count = _atCount[j];
        int pl = parent * dims;
        int jl = j * dims;
        if (_completion.Ready)
        {
            int cd = _completion.Dimension;
            double load = cd < 0 ? 0 : _load[pl + cd] + net.Demand[jl + cd];
            if (cost + _completion.At(j, time, load) >= 0)
            {
                return; // no route through this label can have a negative reduced cost
            }
        }

        for (int k = 0; k < count; k++)
        {
            int e = list[k];
            if (_cost[e] > cost || (timed && _time[e] > time) || (counted && _visits[e] > visits) || (exact && (_mem[e] & ~memory) != 0))
            {
                continue;
            }

            bool lighter = true;
            int el = e * dims;
            for (int d = 0; d < dims && lighter; d++)
            {
                lighter = _load[el + d] <= _load[pl + d] + net.Demand[jl + d];
            }

            if (lighter)
            {
                return;
            }
        }

        if (!exact && count >= HeuristicPerNode)
        {
            // Full: the new label takes the place of the dearest one, or is dropped.
            int worst = 0;
            for (int k = 1; k < count; k++)
            {
                if (_cost[list[k]] > _cost[list[worst]])
                {
                    worst = k;
                }
            }

            if (_cost[list[worst]] <= cost)
            {
                return;
            }

            _dead[list[worst]] = true;
            list[worst] = list[--count];
        }

        // Drop the labels the new one dominates.
        for (int k = 0; k < count; k++)
        {
            int e = list[k];
            if (cost > _cost[e] || (timed && time > _time[e]) || (counted && visits > _visits[e]) || (exact && (memory & ~_mem[e]) != 0))
            {
                continue;
            }

            bool heavier = true;
            int el = e * dims;
            for (int d = 0; d < dims && heavier; d++)
            {
                heavier = _load[pl + d] + net.Demand[jl + d] <= _load[el + d];
            }

            if (heavier)
            {
                _dead[e] = true;
                list[k] = list[--count];
                k--;
            }
        }

        _atCount[j] = count;
        int label = Add(j, cost, time, memory, 0, parent, visits, dims);
        for (int d = 0; d < dims; d++)
        {
            _load[(label * dims) + d] = _load[pl + d] + net.Demand[jl + d];
        }

        if (count == list.Length)
        {
            Array.Resize(ref _atNode[j], list.Length * 2);
            list = _atNode[j];
        }

        list[count] = label;
        _atCount[j] = count + 1;
        _order[label] = timed ? time : counted ? visits : Load(label, dims);
        _queue.Enqueue(label, _order[label]);
    }

    private double Load(int label, int dims)
    {
        double sum = 0;
        for (int d = 0; d < dims; d++)
        {
            sum += _load[(label * dims) + d];
        }

        return sum;
    }

    private int Add(int node, double cost, double time, ulong memory, double load, int parent, int visits, int dims)
    {
        if (_count == _node.Length)
        {
            Grow(dims);
        }

        int k = _count++;
        _node[k] = node;
        _cost[k] = cost;
        _time[k] = time;
        _mem[k] = memory;
        _parent[k] = parent;
        _visits[k] = visits;
        _dead[k] = false;
        for (int d = 0; d < dims; d++)
        {
            _load[(k * dims) + d] = load;
        }

        return k;
    }

    private void Grow(int dims)
    {
        int size = _node.Length * 2;
        Array.Resize(ref _node, size);
        Array.Resize(ref _cost, size);
        Array.Resize(ref _time, size);
        Array.Resize(ref _order, size);
        Array.Resize(ref _mem, size);
        Array.Resize(ref _parent, size);
        Array.Resize(ref _visits, size);
        Array.Resize(ref _dead, size);
        Array.Resize(ref _load, size * Math.Max(1, dims));
    }

    private void Prepare(int n, int dims)
    {
        _count = 0;
        if (_load.Length < _node.Length * Math.Max(1, dims))
        {
            Array.Resize(ref _load, _node.Length * Math.Max(1, dims));
        }

        if (_atNode.Length < n + 2)
        {
            _atNode = new int[n + 2][];
            _atCount = new int[n + 2];
            for (int i = 0; i < n + 2; i++)
            {
                _atNode[i] = new int[8];
            }
        }

        Array.Clear(_atCount);
    }

    private int[] Route(int label)
    {
        int length = 0;
        for (int l = label; _parent[l] >= 0; l = _parent[l])
        {
            length++;
        }

        var route = new int[length];
        for (int l = label; _parent[l] >= 0; l = _parent[l])
        {
            route[--length] = _node[l];
        }

        return route;
    }

    /// <summary>The most negative closed labels seen, at most a given number, without sorting on every offer.</summary>
    private sealed class ColumnPool(int capacity)
    {
        private readonly List<(double Cost, int Label)> _items = [];

        public void Offer(double cost, int label)
        {
            if (_items.Count < capacity)
            {
                _items.Add((cost, label));
                return;
            }

            int worst = 0;
            for (int k = 1; k < _items.Count; k++)
            {
                if (_items[k].Cost > _items[worst].Cost)
                {
                    worst = k;
                }
            }

            if (cost < _items[worst].Cost)
            {
                _items[worst] = (cost, label);
            }
        }

        public IEnumerable<int> Labels()
        {
            _items.Sort((a, b) => a.Cost.CompareTo(b.Cost));
            foreach (var item in _items)
            {
                yield return item.Label;
            }
        }
    }
}
