using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.OrTools;

/// <summary>Vehicles that differ only in their id: the exact model routes them as one anonymous pool, free of symmetry.</summary>
public sealed record VehicleClass(Vehicle Representative, IReadOnlyList<int> Vehicles)
{
    public static IReadOnlyList<VehicleClass> Group(Instance instance)
    {
        var order = new List<string>();
        var members = new Dictionary<string, List<int>>();
        for (int v = 0; v < instance.Vehicles.Count; v++)
        {
            string key = Key(instance.Vehicles[v]);
            if (!members.TryGetValue(key, out var list))
            {
                list = [];
                members[key] = list;
                order.Add(key);
            }

            list.Add(v);
        }

        var classes = new List<VehicleClass>();
        foreach (string key in order)
        {
            classes.Add(new VehicleClass(instance.Vehicles[members[key][0]], members[key]));
        }

        return classes;
    }

    private static string Key(Vehicle v) => string.Join('|',
        v.StartDepot, v.EndDepot, string.Join(',', v.Capacity.Select(c => c.ToString("R", CultureInfo.InvariantCulture))),
        v.ShiftStart.ToString("R", CultureInfo.InvariantCulture), v.ShiftEnd.ToString("R", CultureInfo.InvariantCulture),
        v.MaxDuration.ToString("R", CultureInfo.InvariantCulture), v.FixedCost.ToString("R", CultureInfo.InvariantCulture),
        v.CostPerDistance.ToString("R", CultureInfo.InvariantCulture), v.CostPerHour.ToString("R", CultureInfo.InvariantCulture), v.Equipment);
}
