namespace Anneal.Bounds.Pricing;

/// <summary>
/// A lower bound on the reduced cost of finishing a route from a stop, given how much of one resource (time, or load
/// in one dimension) is already used: a backward dynamic programme over resource buckets with no memory at all, so it
/// admits every ng-route and more. A label whose reduced cost plus this bound is not negative cannot end in a route of
/// negative reduced cost and is dropped: the least reduced cost the pricing reports, once below zero, is unchanged,
/// and at or above zero the bound needs only that fact. Completion bounds of this kind are standard in labelling
/// algorithms (e.g. the q-route bounds of Christofides, Mingozzi &amp; Toth 1981, Math. Programming 20:255-282).
/// <para>
/// The bucket width is just below the least amount of the resource any arc uses, so every step moves to a later
/// bucket and the programme has no cycle; a bucket stands for its lower edge, where finishing is no dearer than
/// later (a later start, or a fuller vehicle, only removes options).
/// </para>
/// </summary>
public sealed class CompletionBound
{
    /// <summary>Most buckets per stop; with a finer resource the bound is not computed.</summary>
    public const int MaxBuckets = 4000;

    private double[] _value = [];
    private int _buckets;
    private double _origin;
    private double _width;
    private int _dimension = -1;

    /// <summary>True when the last <see cref="Compute"/> produced a bound.</summary>
    public bool Ready { get; private set; }

    /// <summary>
    /// Fills the table for the given duals; false (and not <see cref="Ready"/>) when the resource is too fine or
    /// absent, or when <paramref name="cancel"/> fires first (a full table over 1,000 stops takes seconds on a
    /// loaded machine, and the bound must keep its budget).
    /// </summary>
    public bool Compute(PricingNetwork net, double[] dual, CancellationToken cancel = default)
    {
        Ready = false;
        int n = net.N;
        bool timed = net.TimeMatters;
        _dimension = timed ? -1 : BoundedDimension(net);
        if (!timed && _dimension < 0)
        {
            return false;
        }

        double least = double.PositiveInfinity;
        for (int a = 0; a < n; a++)
        {
            for (int s = net.SuccessorStart[a]; s < net.SuccessorStart[a + 1]; s++)
            {
                int b = net.Successors[s];
                double use = timed ? net.ArcTime(a, b) : net.Demand[(b * net.Dimensions) + _dimension];
                least = Math.Min(least, use);
            }
        }

        double top = timed ? Latest(net) : net.Capacity[_dimension];
        _origin = timed ? net.Kind.ShiftStart : 0;
        if (!(least > 0) || !double.IsFinite(top) || !double.IsFinite(least))
        {
            return false;
        }

        _width = least * (1 - 1e-6);
        double span = Math.Max(0, top - _origin);
        if (span / _width > MaxBuckets)
        {
            return false;
        }

        _buckets = (int)Math.Floor(span / _width) + 2;
        if (_value.Length < n * _buckets)
        {
            _value = new double[n * _buckets];
        }

        double latest = net.Kind.LatestReturn;
        for (int b = _buckets - 1; b >= 0; b--)
        {
            if (cancel.IsCancellationRequested)
            {
                return false;
            }

            double edge = _origin + (b * _width);
            for (int j = 0; j < n; j++)
            {
                double best = double.PositiveInfinity;
                if (net.Serves[j])
                {
                    if (!timed || edge + net.ArcTime(j, net.EndNode) <= latest)
                    {
                        best = net.ArcCost(j, net.EndNode);
                    }

                    for (int s = net.SuccessorStart[j]; s < net.SuccessorStart[j + 1]; s++)
                    {
                        int k = net.Successors[s];
                        double next;
                        if (timed)
                        {
                            next = net.Starts.At(k, edge + net.ArcTime(j, k));
                            if (double.IsNaN(next) || next + net.ArcTime(k, net.EndNode) > latest)
                            {
                                continue;
                            }
                        }
                        else
                        {
                            next = edge + net.Demand[(k * net.Dimensions) + _dimension];
                            if (next > net.Capacity[_dimension])
                            {
                                continue;
                            }
                        }

                        int nb = Bucket(next);
                        if (nb <= b)
                        {
                            return false; // cannot happen with the width below the least use; refuse rather than loop
                        }

                        double tail = nb < _buckets ? _value[(k * _buckets) + nb] : double.PositiveInfinity;
                        double via = net.ArcCost(j, k) - dual[k] + tail;
                        if (via < best)
                        {
                            best = via;
                        }
                    }
                }

                _value[(j * _buckets) + b] = best;
            }
        }

        Ready = true;
        return true;
    }

    /// <summary>Lower bound on finishing from stop j with the resource at <paramref name="time"/> (time) or the loads given.</summary>
    public double At(int j, double time, double load)
    {
        int b = Bucket(_dimension < 0 ? time : load);
        return b < _buckets ? _value[(j * _buckets) + b] : double.PositiveInfinity;
    }

    /// <summary>The bucket whose lower edge is at or below the value, with a margin against rounding up at an edge.</summary>
    private int Bucket(double value) => Math.Max(0, (int)Math.Floor(((value - _origin) / _width) - 1e-9));

    /// <summary>The dimension whose load is checked in the labels (-1 when time is).</summary>
    public int Dimension => _dimension;

    private static int BoundedDimension(PricingNetwork net)
    {
        for (int d = 0; d < net.Dimensions; d++)
        {
            if (double.IsFinite(net.Capacity[d]))
            {
                return d;
            }
        }

        return -1;
    }

    private static double Latest(PricingNetwork net)
    {
        double top = net.Kind.LatestReturn;
        if (double.IsFinite(top))
        {
            return top;
        }

        top = net.Kind.ShiftStart;
        for (int j = 0; j < net.N; j++)
        {
            if (net.Serves[j])
            {
                top = Math.Max(top, net.Starts.LatestArrival(j));
            }
        }

        return top;
    }
}
