using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Replanning;
using Anneal.Formats.Input;
using Anneal.Search.Construction;

namespace Anneal.Jobs.Replanning;

/// <summary>
/// Turns a job and a re-plan request into what the solvers run on: the plan file read against the job, `--now` and
/// `--without` checked, the day reduced to its residual instance, and the given plan's rest repaired (new stops and
/// those of vehicles taken out put where they fit, routes breaking hard rules relieved) as every solver's start.
/// </summary>
public static class Replanner
{
    /// <exception cref="InputException">when the plan file, `--now` or `--without` does not fit the job (exit 2).</exception>
    public static (ResidualDay Day, Plan Start) Prepare(Instance job, ReplanInput input)
    {
        var plan = PlanFileReader.Read(input.PlanPath, job);
        var problems = new List<InputProblem>();
        if (input.Now is double now && job.Vehicles.Count > 0)
        {
            double open = job.Vehicles.Min(v => v.ShiftStart);
            double close = job.Vehicles.Max(v => v.ShiftEnd);
            if (now < open || now > close)
            {
                problems.Add(new InputProblem("--now", null, null, job.Units.Format(now),
                    $"the time is outside the job's day ({job.Units.Format(open)} to {job.Units.Format(close)}, its vehicles' shifts)",
                    "give a clock time within the day, e.g. " + job.Units.Format(Math.Min(close, open + 300))));
            }
        }

        var without = new HashSet<int>();
        var ids = job.Vehicles.Select(v => v.Id).ToList();
        foreach (var id in input.Without)
        {
            int v = ids.IndexOf(id);
            if (v < 0)
            {
                var near = Closest.Find(id, ids);
                problems.Add(new InputProblem("--without", null, null, id, "no such vehicle in the job",
                    (near is not null ? $"did you mean '{near}'? " : string.Empty) + "give vehicle ids as routes.csv names them, separated by commas"));
            }
            else
            {
                without.Add(v);
            }
        }

        if (problems.Count > 0)
        {
            throw new InputException(problems);
        }

        ResidualDay day;
        try
        {
            day = DayReduction.Reduce(job, new ReplanRequest(plan, input.Now, without));
        }
        catch (ReplanException e)
        {
            throw new InputException(e.Problems.Select(p => new InputProblem(p.Row > 0 ? input.PlanPath : "--from", p.Row > 0 ? p.Row : null, p.Column, p.Value, p.Problem, p.Fix)).ToList());
        }

        return (day, Salvage.Drivable(day.Instance, day.Start));
    }
}
