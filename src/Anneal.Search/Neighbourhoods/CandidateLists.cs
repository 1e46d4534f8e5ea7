using Anneal.Core.Model;

namespace Anneal.Search.Neighbourhoods;

/// <summary>
/// Granular neighbourhoods (Toth &amp; Vigo 2003): for each stop its k closest stops under a proximity that adds
/// waiting and time-warp terms to the distance (the correlation measure of Vidal et al. 2013), so a sweep over
/// all moves is O(n·k) rather than O(n²).
/// </summary>
public sealed class CandidateLists
{
    private readonly int[] _flat;

    public int K { get; }

    public CandidateLists(Instance instance, int k)
    {
        int n = instance.StopCount;
        K = Math.Max(0, Math.Min(k, n - 1));
        _flat = new int[n * K];
        var best = new double[K];
        var who = new int[K];
        var travel = instance.Travel;
        for (int u = 0; u < n; u++)
        {
            int filled = 0;
            for (int v = 0; v < n; v++)
            {
                if (v == u)
                {
                    continue;
                }

                double c = Math.Min(Proximity(instance, travel, u, v), Proximity(instance, travel, v, u));
                int p;
                if (filled < K)
                {
                    p = filled++;
                }
                else if (K > 0 && c < best[K - 1])
                {
                    p = K - 1;
                }
                else
                {
                    continue;
                }

                while (p > 0 && best[p - 1] > c)
                {
                    best[p] = best[p - 1];
                    who[p] = who[p - 1];
                    p--;
                }

                best[p] = c;
                who[p] = v;
            }

            Array.Copy(who, 0, _flat, u * K, K);
        }
    }

    public ReadOnlySpan<int> Of(int stop) => _flat.AsSpan(stop * K, K);

    public int At(int stop, int index) => _flat[(stop * K) + index];

    private static double Proximity(Instance instance, Core.Travel.TravelTable travel, int u, int v)
    {
        const double waitWeight = 0.2;
        const double warpWeight = 1.0;
        var wu = instance.Hull(u);
        var wv = instance.Hull(v);
        double t = travel.Duration(u, v);
        double s = instance.ServiceTime(u);
        double wait = Math.Max(0, wv.Open - s - t - wu.Close);
        double warp = Math.Max(0, wu.Open + s + t - wv.Close);
        if (double.IsNaN(wait) || double.IsInfinity(wait))
        {
            wait = 0;
        }

        if (double.IsNaN(warp) || double.IsInfinity(warp))
        {
            warp = 0;
        }

        return travel.Distance(u, v) + (waitWeight * wait) + (warpWeight * warp);
    }
}
