using Anneal.Core.Evaluation;

namespace Anneal.Core.Replanning;

/// <summary>Why a stop is listed in changes.csv (its `reason` column).</summary>
public enum ChangeReason
{
    New,
    Cancelled,
    Moved,
    Retimed,
}

/// <summary>One stop the re-plan changed; vehicles are ids, null for none (unserved, or not in that plan).</summary>
public sealed record StopChange(string Stop, string? OldVehicle, string? NewVehicle, double? OldStart, double? NewStart, ChangeReason Reason, string Note);

/// <summary>The changes of a re-plan against its given plan, and the counts its summary line gives.</summary>
public sealed record DayChanges(IReadOnlyList<StopChange> Stops, int Added, int Cancelled, int Moved, int Retimed, double ToleranceMinutes)
{
    public static string ReasonText(ChangeReason reason) => reason switch
    {
        ChangeReason.New => "new",
        ChangeReason.Cancelled => "cancelled",
        ChangeReason.Moved => "moved",
        _ => "retimed",
    };

    /// <summary>"3 stops added, 1 cancelled, 7 moved to another van, 12 retimed by more than 15 min".</summary>
    public string Summary(string timeWords) => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"{Added} {(Added == 1 ? "stop" : "stops")} added, {Cancelled} cancelled, {Moved} moved to another van, {Retimed} retimed by more than {ToleranceMinutes:0.##} {timeWords}");

    /// <summary>
    /// Compares the given plan with the re-plan: the fixed visits as they were, every other stop where the residual
    /// plan (judged by the evaluator) serves it. A stop is retimed when it stays on its vehicle and its start moves by
    /// more than the stability tolerance.
    /// </summary>
    public static DayChanges Compute(ResidualDay day, PlanEvaluation residual)
    {
        var job = day.Day;
        double tolerance = job.Rules.Stability.ToleranceMinutes;
        int n = job.StopCount;
        var newVehicle = new int[n];
        var newStart = new double?[n];
        Array.Fill(newVehicle, -1);
        foreach (var part in day.Fixed)
        {
            foreach (var visit in part.Visits)
            {
                newVehicle[visit.Stop] = part.Vehicle;
                newStart[visit.Stop] = visit.Start;
            }
        }

        foreach (var route in residual.Routes)
        {
            for (int k = 0; k < route.Stops.Length; k++)
            {
                int s = day.DayStop[route.Stops[k]];
                newVehicle[s] = day.DayVehicle[route.Vehicle];
                newStart[s] = route.Visits[k].Start;
            }
        }

        var changes = new List<StopChange>();
        int moved = 0, retimed = 0;
        var inPlan = new bool[n];
        foreach (var route in day.Request.Plan.Routes)
        {
            string oldId = job.Vehicles[route.Vehicle].Id;
            bool out_ = day.Fixed[route.Vehicle].TakenOut;
            foreach (var visit in route.Visits)
            {
                if (visit.Stop < 0)
                {
                    changes.Add(new StopChange(visit.StopId, oldId, null, visit.Start, null, ChangeReason.Cancelled, "not in the job's stops any more"));
                    continue;
                }

                inPlan[visit.Stop] = true;
                int now = newVehicle[visit.Stop];
                string? nowId = now >= 0 ? job.Vehicles[now].Id : null;
                if (now != route.Vehicle)
                {
                    moved++;
                    string why = out_ ? $"vehicle {oldId} taken out" : "moved by the re-plan";
                    changes.Add(new StopChange(visit.StopId, oldId, nowId, visit.Start, newStart[visit.Stop], ChangeReason.Moved,
                        now < 0 ? why + "; unserved: " + UnservedWhy(job, visit.Stop) : why));
                }
                else if (visit.Start is double a && newStart[visit.Stop] is double b && Math.Abs(b - a) > tolerance + 1e-9)
                {
                    retimed++;
                    changes.Add(new StopChange(visit.StopId, oldId, nowId, a, b, ChangeReason.Retimed, string.Empty));
                }
            }
        }

        foreach (int s in day.NewStops)
        {
            int now = newVehicle[s];
            changes.Add(new StopChange(job.Stops[s].Id, null, now >= 0 ? job.Vehicles[now].Id : null, null, newStart[s], ChangeReason.New,
                now >= 0 ? string.Empty : "unserved: " + UnservedWhy(job, s)));
        }

        return new DayChanges(changes, day.NewStops.Count, day.Cancelled.Count, moved, retimed, tolerance);
    }

    private static string UnservedWhy(Model.Instance job, int stop) =>
        job.MayDrop(stop) ? "left out at its penalty" : "no vehicle left can take it within the hard rules";
}
