namespace Anneal.Core.Model;

/// <summary>Collect-and-deliver pairs: links each delivery stop to its collection stop and back.</summary>
public static class Pairs
{
    /// <summary>
    /// Per stop, the other stop of its pair, or -1. Readers check the links first and explain each mistake;
    /// this refuses what they let through.
    /// </summary>
    /// <exception cref="ArgumentException">when a link points nowhere, at itself, at another delivery, or two deliveries share a collection.</exception>
    public static int[] Link(IReadOnlyList<Stop> stops)
    {
        var partner = new int[stops.Count];
        Array.Fill(partner, -1);
        for (int d = 0; d < stops.Count; d++)
        {
            int c = stops[d].CollectFrom;
            if (c < 0)
            {
                continue;
            }

            if (c >= stops.Count || c == d)
            {
                throw new ArgumentException($"stop {stops[d].Id} collects from stop index {c}, which is not another stop", nameof(stops));
            }

            if (stops[c].CollectFrom >= 0)
            {
                throw new ArgumentException($"stop {stops[d].Id} collects from {stops[c].Id}, which is itself a delivery of a pair", nameof(stops));
            }

            if (partner[c] >= 0)
            {
                throw new ArgumentException($"stops {stops[partner[c]].Id} and {stops[d].Id} both collect from {stops[c].Id}", nameof(stops));
            }

            partner[c] = d;
            partner[d] = c;
        }

        return partner;
    }
}
