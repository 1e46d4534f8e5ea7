using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Search.Construction;

namespace Anneal.Search.Running;

/// <summary>
/// Judges a solver's result with the evaluator. A plan that breaks hard rules is also offered in its drivable form
/// (<see cref="Salvage"/>), and that form is kept when <see cref="PlanRanking"/> puts it first, with a note saying so.
/// </summary>
public static class ResultJudge
{
    public static JudgedResult Judge(Instance instance, SolverResult result)
    {
        var evaluation = PlanEvaluator.Evaluate(instance, result.Plan);
        if (!result.HasPlan || evaluation.Feasible)
        {
            return new JudgedResult(result, evaluation);
        }

        var plan = Salvage.Drivable(instance, result.Plan);
        var drivable = PlanEvaluator.Evaluate(instance, plan);
        if (!PlanRanking.IsBetter(drivable, evaluation))
        {
            return new JudgedResult(result, evaluation);
        }

        int left = drivable.Unserved.Count;
        var notes = new List<string>(result.Notes ?? [])
        {
            $"its plan broke hard rules; stops were taken off the routes that broke them and put back where they fit, so that every route keeps the hard rules"
                + (left == 0 ? string.Empty : $" ({(left == 1 ? "1 stop" : $"{left} stops")} left unserved)"),
        };
        return new JudgedResult(result with { Plan = plan, Notes = notes }, drivable);
    }
}
