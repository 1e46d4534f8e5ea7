using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Core.Screening;

/// <summary>
/// Collect-and-deliver pairs and collections no plan can serve: the goods collected do not fit any vehicle, or the
/// delivery's last window closes before a vehicle collecting at the first opening (plus service and the direct trip)
/// can arrive. Both are relaxations (the earliest possible collection, the direct trip), so what they report holds for
/// every plan.
/// </summary>
public static class PairScreen
{
    public static void Screen(Instance instance, List<Obstacle> found)
    {
        if (!instance.HasPickups || instance.Vehicles.Count == 0)
        {
            return;
        }

        for (int s = 0; s < instance.StopCount; s++)
        {
            if (instance.Rules.Capacity.Hard)
            {
                Load(instance, s, found);
            }

            int d = instance.Partner(s);
            if (d >= 0 && instance.IsCollection(s) && instance.Rules.TimeWindows.Hard)
            {
                var collect = instance.Hull(s);
                var deliver = instance.Hull(d);
                double earliest = collect.Open + instance.ServiceTime(s) + instance.Travel.Duration(s, d);
                if (earliest > deliver.Close + 1e-6)
                {
                    found.Add(new Obstacle("pair", instance.Stops[d].Id,
                        $"the pair {instance.Stops[s].Id}>{instance.Stops[d].Id} cannot be served: collected at the earliest at {instance.Units.Format(collect.Open)}, the goods reach {instance.Stops[d].Id} at {instance.Units.Format(earliest)}, after its last window closes at {instance.Units.Format(deliver.Close)}"));
                }
            }
        }
    }

    private static void Load(Instance instance, int s, List<Obstacle> found)
    {
        for (int k = 0; k < instance.DimensionCount; k++)
        {
            double largest = 0;
            for (int v = 0; v < instance.Vehicles.Count; v++)
            {
                largest = Math.Max(largest, instance.Capacity(v, k));
            }

            double collected = instance.Pickup(s, k);
            if (collected > largest)
            {
                string unit = StopScreen.DimensionName(instance, k);
                found.Add(new Obstacle("capacity", instance.Stops[s].Id,
                    $"stop {instance.Stops[s].Id} hands over {collected.ToString("0.##", CultureInfo.InvariantCulture)} {unit}; the largest vehicle carries {largest.ToString("0.##", CultureInfo.InvariantCulture)} {unit}"));
            }
        }
    }
}
