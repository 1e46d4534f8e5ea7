using System.Text.Json;
using System.Text.Json.Serialization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Formats.Output;

/// <summary>summary.json: the plan's verdict and cost breakdown, every solver's result and the run's settings.</summary>
public static class SummaryJsonWriter
{
    public const string FileName = "summary.json";

    public static JsonSerializerOptions Options { get; } = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        Encoder = JsonText.Encoder,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,

        // A diverged solver may report an infinite objective; write it rather than fail the whole run.
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    public static void Write(string path, SummaryDocument document) =>
        AtomicFile.Write(path, stream => JsonSerializer.Serialize(stream, document, Options));

    /// <summary>The plan part of the summary from the evaluator's verdict.</summary>
    public static PlanSummary Describe(Instance instance, PlanEvaluation evaluation)
    {
        var b = evaluation.Breakdown;
        var unserved = new List<string>(evaluation.Unserved.Count);
        var unservedStops = new List<StopSummary>(evaluation.Unserved.Count);
        foreach (int s in evaluation.Unserved)
        {
            var stop = instance.Stops[s];
            unserved.Add(stop.Id);
            unservedStops.Add(new StopSummary(stop.Id, stop.Name, stop.Address));
        }

        var violations = new List<ViolationSummary>(evaluation.Violations.Count);
        foreach (var v in evaluation.Violations)
        {
            violations.Add(new ViolationSummary(v.Rule.ToText(), v.Hard, v.Vehicle, v.Stop, v.Amount, v.Message));
        }

        return new PlanSummary(
            evaluation.Objective,
            evaluation.Distance,
            evaluation.Duration,
            evaluation.VehiclesUsed,
            evaluation.Feasible,
            unserved,
            new BreakdownSummary(b.Fixed, b.Distance, b.Time, b.Vehicles, b.Lateness, b.Overload, b.Overtime, b.DurationExcess, b.Unserved, b.Total, b.Stability, b.DrivingOver),
            violations,
            unservedStops) { Driving = Driving(instance, evaluation) };
    }

    private static List<RouteDrivingSummary> Driving(Instance instance, PlanEvaluation evaluation)
    {
        var list = new List<RouteDrivingSummary>();
        foreach (var route in evaluation.Routes)
        {
            var v = instance.Vehicles[route.Vehicle];
            if (v.DrivingRules is not { } rules || route.Stops.Length == 0)
            {
                continue;
            }

            var m = route.Metrics;
            var (drive, span) = Core.DrivingRules.BreakScheduler.Excess(instance, rules, m);
            var breaches = new Dictionary<string, double>
            {
                [RuleKind.DrivingTime.ToText()] = drive,
                [RuleKind.DutySpan.ToText()] = span,
            };
            list.Add(new RouteDrivingSummary(v.Id, rules.Name, rules.Source, rules.Rule.Hard, m.Driving, m.BreakMinutes, route.Breaks.Count, m.Return - m.Departure, breaches));
        }

        return list;
    }
}
