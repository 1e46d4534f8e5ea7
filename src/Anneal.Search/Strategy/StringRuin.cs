using Anneal.Core.Evaluation;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Ruin and recreate by string removals (after Christiaens &amp; Vanden Berghe 2020, Transportation Science
/// 54(2):417-433): strings of consecutive stops (some split, sparing a run in the middle) are cut from a few routes
/// near a random seed stop, then the stops go back one at a time at their cheapest position that keeps to the hard
/// rules, on a route that serves one of their candidate neighbours, each position skipped with a small probability
/// ("blinks"). No route is opened, so a held fleet stays held. The whole change is one move: kept under the
/// caller's temperature, or undone route by route.
/// </summary>
public sealed class StringRuin
{
    /// <summary>Mean number of stops removed (the paper's c̄).</summary>
    public const int MeanRemoved = 10;

    /// <summary>Longest string cut from one route (the paper's L^max).</summary>
    public const int LongestString = 10;

    private const double BlinkRate = 0.01;

    /// <summary>Share of strings cut as split strings, which spare a run of stops in their middle (the paper's 0.5).</summary>
    private const double SplitRate = 0.5;

    private readonly SearchState _state;
    private readonly CandidateLists _candidates;
    private readonly SearchRandom _rng;
    private readonly int[] _removed;
    private readonly double[] _keys;
    private readonly int[] _buffer;
    private readonly bool[] _ruined;
    private readonly int[] _touched;
    private readonly bool[] _isTouched;
    private readonly int[] _savedStart;
    private readonly int[] _savedLength;
    private readonly int[] _saved;
    private int _removedCount;
    private int _touchedCount;
    private int _savedCount;
    private MoveDraft _move;
    private readonly int[] _seen;
    private int _stamp;
    private readonly PairInsertion? _pairs;

    public StringRuin(SearchState state, CandidateLists candidates, SearchRandom rng)
    {
        _state = state;
        _candidates = candidates;
        _rng = rng;
        int n = state.StopCount;
        _removed = new int[n];
        _keys = new double[n];
        _buffer = new int[n];
        _saved = new int[n];
        _ruined = new bool[state.RouteCount];
        _touched = new int[state.RouteCount];
        _isTouched = new bool[state.RouteCount];
        _savedStart = new int[state.RouteCount];
        _savedLength = new int[state.RouteCount];
        _seen = new int[state.RouteCount];
        _pairs = state.Instance.HasPairs ? new PairInsertion(state) : null;
    }

    /// <summary>
    /// Ruins and recreates the state's plan, which must keep to the hard rules. The result is kept when it does too
    /// and its objective is below the old one plus <c>-temperature·ln(u)</c> (u uniform), else the old plan is put
    /// back. Returns whether the change was kept.
    /// </summary>
    public bool Attempt(double temperature)
    {
        double before = _state.Objective;
        Ruin();
        Recreate();
        double allowance = -temperature * Math.Log(1 - _rng.NextDouble());
        bool kept = _state.Feasible && _state.Objective < before + allowance;
        if (!kept)
        {
            Undo();
        }

        for (int k = 0; k < _touchedCount; k++)
        {
            _isTouched[_touched[k]] = false;
            _ruined[_touched[k]] = false;
        }

        _touchedCount = 0;
        _savedCount = 0;
        return kept;
    }

    /// <summary>
    /// Cuts one string from each of up to k routes met walking out from a random seed stop; half the strings are
    /// split, sparing a run of stops in their middle.
    /// </summary>
    private void Ruin()
    {
        var s = _state;
        _removedCount = 0;
        int used = s.UsedRoutes;
        int seed = s.UnservedCount < s.StopCount ? RandomRoutedStop() : -1;
        if (used == 0 || seed < 0)
        {
            return;
        }

        double meanLength = (double)(s.StopCount - s.UnservedCount) / used;
        int stringMax = (int)Math.Max(1, Math.Min(LongestString, meanLength));
        double routesMax = (4.0 * MeanRemoved / (1 + stringMax)) - 1;
        int routes = (int)(1 + (_rng.NextDouble() * routesMax));
        int ruined = 0;
        for (int k = -1; k < _candidates.K && ruined < routes; k++)
        {
            int c = k < 0 ? seed : _candidates.At(seed, k);
            int r = s.RouteOf(c);
            if (r < 0 || _ruined[r])
            {
                continue;
            }

            int len = s.Length(r);
            int cut = 1 + _rng.Next(Math.Min(len, stringMax));
            int spared = cut > 1 && cut < len && _rng.NextDouble() < SplitRate ? SpareLength(len, cut) : 0;
            int window = cut + spared;
            int pos = s.PositionOf(c);
            int lowest = Math.Max(0, pos - window + 1);
            int highest = Math.Min(pos, len - window);
            int from = lowest + _rng.Next(highest - lowest + 1);
            int spareFrom = spared > 0 ? from + 1 + _rng.Next(cut - 1) : -1;
            Save(r);
            int kept = 0;
            for (int p = 0; p < len; p++)
            {
                int stop = s.StopAt(r, p);
                bool spare = spareFrom >= 0 && p >= spareFrom && p < spareFrom + spared;
                if (p >= from && p < from + window && !spare)
                {
                    _removed[_removedCount++] = stop;
                }
                else
                {
                    _buffer[kept++] = stop;
                }
            }

            s.SetRoute(r, _buffer.AsSpan(0, kept));
            _ruined[r] = true;
            ruined++;
        }

        if (_pairs is not null)
        {
            RemovePartners();
        }
    }

    /// <summary>Whole pairs only: the partner of every removed stop leaves its route too.</summary>
    private void RemovePartners()
    {
        var s = _state;
        int removed = _removedCount;
        for (int k = 0; k < removed; k++)
        {
            int partner = s.Instance.Partner(_removed[k]);
            int r = partner >= 0 ? s.RouteOf(partner) : -1;
            if (r < 0)
            {
                continue;
            }

            Save(r);
            int kept = 0;
            foreach (int stop in s.Route(r))
            {
                if (stop != partner)
                {
                    _buffer[kept++] = stop;
                }
            }

            s.SetRoute(r, _buffer.AsSpan(0, kept));
            _removed[_removedCount++] = partner;
        }
    }

    /// <summary>Stops kept inside a split string: one more while a draw exceeds the paper's β = 0.01.</summary>
    private int SpareLength(int len, int cut)
    {
        int m = 1;
        while (cut + m < len && _rng.NextDouble() > 0.01)
        {
            m++;
        }

        return m;
    }

    private int RandomRoutedStop()
    {
        for (int tries = 0; tries < 64; tries++)
        {
            int stop = _rng.Next(_state.StopCount);
            if (_state.RouteOf(stop) >= 0)
            {
                return stop;
            }
        }

        return -1;
    }

    /// <summary>Puts the removed stops back, in one of the paper's orders; a stop that fits nowhere stays out.</summary>
    private void Recreate()
    {
        Order();
        var instance = _state.Instance;
        for (int k = 0; k < _removedCount; k++)
        {
            int stop = _removed[k];
            if (_pairs is not null && instance.Partner(stop) >= 0)
            {
                if (_state.RouteOf(stop) < 0 && !RecreatePair(stop))
                {
                    return;
                }

                continue;
            }

            if (!BestPosition(stop, out int anchor, out bool after, out double cost))
            {
                if (!instance.MayDrop(stop))
                {
                    return;
                }

                continue;
            }

            if (instance.MayDrop(stop) && cost >= CostModel.UnservedObjective(instance, stop))
            {
                continue;
            }

            Save(_state.RouteOf(anchor));
            MoveBuilder.Insert(_state, ref _move, stop, anchor, after);
            _state.Apply(ref _move);
        }
    }

    /// <summary>
    /// Both ends of the stop's pair at their cheapest feasible positions on a route that serves a candidate neighbour
    /// of either end. False when a mandatory pair fits nowhere (the attempt then fails).
    /// </summary>
    private bool RecreatePair(int stop)
    {
        var instance = _state.Instance;
        int c = instance.IsCollection(stop) ? stop : instance.Partner(stop);
        int d = instance.Partner(c);
        var best = PairInsertion.Choice.None;
        _pairs!.ScanNear(c, d, _candidates, feasibleOnly: true, ref best);
        bool optional = instance.MayDrop(c) && instance.MayDrop(d);
        if (best.Route < 0)
        {
            return optional;
        }

        if (optional && best.Cost >= CostModel.UnservedObjective(instance, c) + CostModel.UnservedObjective(instance, d))
        {
            return true;
        }

        Save(best.Route);
        _pairs!.Apply(c, d, best);
        return true;
    }

    /// <summary>Random order, or largest demand, farthest from the depot, or tightest window first (weights 4:4:2:1).</summary>
    private void Order()
    {
        var instance = _state.Instance;
        int pick = _rng.Next(11);
        if (pick < 4)
        {
            for (int k = _removedCount - 1; k > 0; k--)
            {
                int j = _rng.Next(k + 1);
                (_removed[k], _removed[j]) = (_removed[j], _removed[k]);
            }

            return;
        }

        for (int k = 0; k < _removedCount; k++)
        {
            int stop = _removed[k];
            _keys[k] = pick switch
            {
                < 8 => -(instance.DimensionCount > 0 ? instance.Demand(stop, 0) : 0),
                < 10 => -instance.Travel.Distance(instance.DepotLocation(0), stop),
                _ => instance.Hull(stop).Close - instance.Hull(stop).Open,
            };
        }

        Array.Sort(_keys, _removed, 0, _removedCount);
    }

    /// <summary>Cheapest feasible position on a route that serves a candidate neighbour, else on any route.</summary>
    private bool BestPosition(int stop, out int anchor, out bool after, out double cost)
    {
        anchor = -1;
        after = false;
        cost = double.PositiveInfinity;
        _stamp++;
        for (int k = 0; k < _candidates.K; k++)
        {
            int r = _state.RouteOf(_candidates.At(stop, k));
            if (r < 0 || _seen[r] == _stamp)
            {
                continue;
            }

            // Every gap of the route, not only those beside the neighbour: windows often rule those out.
            _seen[r] = _stamp;
            int len = _state.Length(r);
            for (int p = 0; p < len; p++)
            {
                Consider(stop, _state.StopAt(r, p), ref anchor, ref after, ref cost, p == len - 1 ? 2 : 1);
            }
        }

        if (anchor >= 0)
        {
            return true;
        }

        var s = _state;
        for (int r = 0; r < s.RouteCount; r++)
        {
            for (int p = 0; p < s.Length(r); p++)
            {
                Consider(stop, s.StopAt(r, p), ref anchor, ref after, ref cost);
            }
        }

        return anchor >= 0;
    }

    private void Consider(int stop, int neighbour, ref int anchor, ref bool after, ref double cost, int sides = 2)
    {
        if (_state.RouteOf(neighbour) < 0)
        {
            return;
        }

        for (int side = 0; side < sides; side++)
        {
            if (_rng.NextDouble() < BlinkRate)
            {
                continue;
            }

            MoveBuilder.Insert(_state, ref _move, stop, neighbour, side == 1);
            if (_state.FeasibleChange(ref _move.A, out double change) && change < cost)
            {
                (anchor, after, cost) = (neighbour, side == 1, change);
            }
        }
    }

    /// <summary>Keeps a route's stops as they were before this attempt first changed it.</summary>
    private void Save(int route)
    {
        if (_isTouched[route])
        {
            return;
        }

        _isTouched[route] = true;
        _touched[_touchedCount++] = route;
        _savedStart[route] = _savedCount;
        _savedLength[route] = _state.Length(route);
        _state.Route(route).CopyTo(_saved.AsSpan(_savedCount));
        _savedCount += _savedLength[route];
    }

    /// <summary>Puts every changed route back as it was: all are emptied first, since stops moved between them.</summary>
    private void Undo()
    {
        for (int k = 0; k < _touchedCount; k++)
        {
            _state.SetRoute(_touched[k], ReadOnlySpan<int>.Empty);
        }

        for (int k = 0; k < _touchedCount; k++)
        {
            int r = _touched[k];
            _state.SetRoute(r, _saved.AsSpan(_savedStart[r], _savedLength[r]));
        }
    }
}
