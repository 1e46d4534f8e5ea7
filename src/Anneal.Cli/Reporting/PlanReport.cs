using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Formats.Output;

namespace Anneal.Cli.Reporting;

/// <summary>The printed verdict on a plan: objective and its parts, vehicles, distance, feasibility, every violation, the cautions.</summary>
public static class PlanReport
{
    /// <param name="searchSeconds">The search budget, when a search made the plan (an infeasible plan then says the search found no better).</param>
    public static void Print(TextWriter w, Instance instance, PlanEvaluation e, double? searchSeconds = null)
    {
        int hardCount = 0;
        foreach (var v in e.Violations)
        {
            hardCount += v.Hard ? 1 : 0;
        }

        string unit = instance.Units.DistanceSuffix;
        string timeUnit = instance.Units.TimeSuffix;
        w.WriteLine(e.Feasible ? "Plan: feasible (breaks no hard rule)" : $"Plan: INFEASIBLE (breaks {InstanceDescription.Plural(hardCount, "hard rule")})");
        w.WriteLine(Line("objective", $"{Num(e.Objective)} ({instance.Objective.ToText()})"));
        w.WriteLine(Line("  made of", Breakdown(e.Breakdown)));
        w.WriteLine(Line("vehicles", $"{e.VehiclesUsed} of {instance.Vehicles.Count}"));
        w.WriteLine(Line("distance", Num(e.Distance) + unit));
        w.WriteLine(Line("duration", Num(e.Duration) + timeUnit + " (sum over routes)"));
        var unserved = new List<string>();
        foreach (int s in e.Unserved)
        {
            unserved.Add(instance.Stops[s].Id);
        }

        w.WriteLine(Line("unserved", unserved.Count == 0 ? "none" : $"{unserved.Count}: {string.Join(", ", unserved)}"));
        if (e.Violations.Count > 0)
        {
            w.WriteLine($"Violations ({e.Violations.Count}):");
            foreach (var v in e.Violations)
            {
                w.WriteLine($"  {(v.Hard ? "hard" : "soft")}  {v.Rule.ToText(),-13} {v.Message}");
            }
        }

        if (!e.Feasible)
        {
            PrintWhy(w, instance, searchSeconds);
        }

        PrintCautions(w);
    }

    /// <summary>For an infeasible plan: what the screening says no plan can do, or that it found no single cause.</summary>
    private static void PrintWhy(TextWriter w, Instance instance, double? searchSeconds)
    {
        var obstacles = JobScreen.Screen(instance);
        if (obstacles.Count == 0)
        {
            if (searchSeconds is { } seconds)
            {
                w.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"Why: no solver found a plan that keeps every hard rule in {seconds:0.##} s, and the screening found no single cause; the rules may be too tight together for the fleet, or more time may find one."));
            }

            return;
        }

        w.WriteLine("Cannot be done, whatever the plan:");
        foreach (var o in obstacles)
        {
            w.WriteLine("  - " + o.Message);
        }
    }

    public static void PrintCautions(TextWriter w)
    {
        w.WriteLine("Cautions:");
        foreach (var c in Cautions.All)
        {
            w.WriteLine("  - " + c);
        }
    }

    public static string Num(double value) => value.ToString("0.00", CultureInfo.InvariantCulture);

    private static string Line(string label, string value) => $"  {label,-10} {value}";

    private static string Breakdown(CostBreakdown b)
    {
        var parts = new List<string>();
        Add("fixed", b.Fixed);
        Add("distance", b.Distance);
        Add("time", b.Time);
        Add("vehicles", b.Vehicles);
        Add("lateness", b.Lateness);
        Add("overload", b.Overload);
        Add("overtime", b.Overtime);
        Add("duration excess", b.DurationExcess);
        Add("unserved", b.Unserved);
        Add("stability", b.Stability);
        return parts.Count == 0 ? "nothing (every part is zero)" : string.Join(" + ", parts);

        void Add(string name, double value)
        {
            if (value != 0)
            {
                parts.Add($"{name} {Num(value)}");
            }
        }
    }
}
