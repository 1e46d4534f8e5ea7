using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Formats.Input.Text;

/// <summary>The fleet of a benchmark file: identical vehicles numbered 1..n, one capacity, the depot's opening hours as shift.</summary>
internal static class BenchmarkFleet
{
    public static Vehicle[] Identical(int count, double capacity, double shiftStart, double shiftEnd)
    {
        var vehicles = new Vehicle[count];
        for (int k = 0; k < count; k++)
        {
            vehicles[k] = new Vehicle
            {
                Id = (k + 1).ToString(CultureInfo.InvariantCulture),
                Capacity = [capacity],
                ShiftStart = shiftStart,
                ShiftEnd = shiftEnd,
            };
        }

        return vehicles;
    }
}
