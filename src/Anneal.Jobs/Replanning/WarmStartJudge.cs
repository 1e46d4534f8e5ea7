using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Anneal.Search.Running;

namespace Anneal.Jobs.Replanning;

/// <summary>
/// Judges the results of a run that started from a given plan: each solver's trace begins with that plan (as the
/// evaluator costs it), and a solver whose plan comes after it in <see cref="PlanRanking"/>'s order returns the
/// start plan instead, with a note. So a warm start never ends worse than the plan it was given.
/// </summary>
public sealed class WarmStartJudge(Instance instance, Plan start)
{
    private readonly PlanEvaluation _start = PlanEvaluator.Evaluate(instance, start);

    public PlanEvaluation Start => _start;

    public JudgedResult Judge(Instance judgedInstance, SolverResult result)
    {
        var judged = ResultJudge.Judge(judgedInstance, result);
        if (result.BoundOnly || result.Status == SolverStatus.Declined)
        {
            return judged;
        }

        var first = new TracePoint(0, 0, _start.Objective, _start.Objective, _start.Feasible, "given plan");
        var trace = new List<TracePoint>(judged.Result.Trace.Count + 1) { first };
        trace.AddRange(judged.Result.Trace);
        var r = judged.Result with { Trace = trace };
        if (judged.Result.HasPlan && !PlanRanking.IsBetter(_start, judged.Evaluation))
        {
            return new JudgedResult(r, judged.Evaluation);
        }

        var notes = new List<string>(r.Notes ?? []) { "its plan was not better than the plan it started from, which is kept" };
        return new JudgedResult(r with { Plan = start, Notes = notes, SecondsToBest = 0 } with { HasPlan = true }, _start);
    }
}
