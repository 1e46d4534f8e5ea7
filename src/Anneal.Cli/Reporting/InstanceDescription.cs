using System.Globalization;
using Anneal.Core.Model;

namespace Anneal.Cli.Reporting;

/// <summary>What an instance holds, in two lines: its size and which rules are hard or soft.</summary>
public static class InstanceDescription
{
    public static string Size(Instance instance)
    {
        string dims = instance.DimensionCount == 0 ? "none" : string.Join(", ", instance.DimensionNames);
        string equipment = instance.EquipmentNames.Count == 0 ? "none" : string.Join(", ", instance.EquipmentNames);
        return $"{instance.Name}: {Plural(instance.StopCount, "stop")}, {Plural(instance.Depots.Count, "depot")}, "
            + $"{Plural(instance.Vehicles.Count, "vehicle")}; dimensions {dims}; equipment {equipment}; objective {instance.Objective.ToText()}";
    }

    public static string Rules(Instance instance)
    {
        var r = instance.Rules;
        string unit = instance.Units.TimeWord;
        var hard = new List<string>();
        var soft = new List<string>();
        Sort("time windows", r.TimeWindows, "per " + unit + " late");
        Sort("capacity", r.Capacity, "per unit over");
        Sort("shift end", r.ShiftEnd, "per " + unit + " over");
        Sort("max duration", r.MaxDuration, "per " + unit + " over");
        Sort("unserved", r.Unserved, "per stop");
        string hardText = hard.Count == 0 ? "none" : string.Join(", ", hard);
        string softText = soft.Count == 0 ? "none" : string.Join(", ", soft);
        return $"rules: hard {hardText}, equipment; soft {softText}";

        void Sort(string name, Rule rule, string per)
        {
            if (rule.Hard)
            {
                hard.Add(name);
            }
            else
            {
                soft.Add(string.Create(CultureInfo.InvariantCulture, $"{name} ({rule.Price:0.##} {per})"));
            }
        }
    }

    public static string Plural(int n, string noun) => n == 1 ? $"1 {noun}" : $"{n} {noun}s";
}
