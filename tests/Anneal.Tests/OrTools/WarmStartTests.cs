using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.OrTools;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Core.Solving;

namespace Anneal.Tests.OrTools;

/// <summary>
/// Both OR-Tools solvers start from Anneal's construction: on a tightly packed job, where OR-Tools' own first
/// solution heuristic finds nothing, they return a feasible plan at least as good as that construction.
/// </summary>
public sealed class WarmStartTests
{
    [Theory]
    [InlineData(11)]
    [InlineData(12)]
    public void RoutingReturnsAtLeastTheConstruction(int seed)
    {
        var instance = TinyInstances.Tight(seed);
        var construction = Construction(instance);
        var run = new OrToolsSolver(start: new InsertionStart()).Run(instance, new SolveOptions { IterationLimit = 50, TimeLimit = TimeSpan.FromSeconds(60) }, null, default);
        var judged = PlanEvaluator.Evaluate(instance, run.Result.Plan);
        Assert.True(judged.Feasible, $"{run.Result.Status}: {string.Join("; ", run.Result.Notes ?? [])}");
        Assert.True(judged.Objective <= construction.Objective + 1e-9, $"OR-Tools {judged.Objective}, construction {construction.Objective}");
        Assert.Contains(run.Result.Notes ?? [], n => n.StartsWith("warm start from Anneal's construction", StringComparison.Ordinal));
    }

    [Fact]
    public void SavingsAloneFindsNothingOnTheTightJob()
    {
        // Why the warm start matters: without it OR-Tools has no plan for this job (the case the tests above cover).
        var instance = TinyInstances.Tight(11);
        using var mapping = RoutingModelBuilder.Build(instance);
        var parameters = Google.OrTools.ConstraintSolver.operations_research_constraint_solver.DefaultRoutingSearchParameters();
        parameters.FirstSolutionStrategy = Google.OrTools.ConstraintSolver.FirstSolutionStrategy.Types.Value.Savings;
        parameters.TimeLimit = Google.Protobuf.WellKnownTypes.Duration.FromTimeSpan(TimeSpan.FromSeconds(5));
        parameters.SolutionLimit = 1;
        Assert.Null(mapping.Model.SolveWithParameters(parameters));
    }

    [Fact]
    public void ExactReturnsAFeasiblePlanAndABoundFromTheHint()
    {
        // Deadline only (no iteration limit): the answer must arrive and be feasible; its quality is not checked.
        var instance = TinyInstances.Tight(11);
        var construction = Construction(instance);
        var result = new ExactSolver(start: new InsertionStart()).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(5) }, null, default);
        var judged = PlanEvaluator.Evaluate(instance, result.Plan);
        Assert.True(judged.Feasible, result.Status.ToText());
        Assert.True(judged.Objective <= construction.Objective + 1e-9);
        Assert.True(result.LowerBound is not null, $"{result.Status.ToText()}: {string.Join("; ", result.Notes ?? [])}");
        Assert.True(result.LowerBound <= judged.Objective + 1e-6);
    }

    [Fact]
    public void Exact_says_when_its_plan_is_the_construction_it_was_hinted_with()
    {
        // One stop, one vehicle: the construction is the only plan, so CP-SAT can find none better and the plan it
        // returns is its hint. The first note must say so; without a hint the plan is CP-SAT's own and no note does.
        var instance = TinyInstances.Line([TinyInstances.Stop("a", 5)], [TinyInstances.Vehicle("v")], RuleSet.AllHard);
        var options = new SolveOptions { TimeLimit = TimeSpan.FromSeconds(10) }; // a ceiling: the proof takes milliseconds
        const string said = "its plan is Anneal's construction, the hint it was given";

        var hinted = new ExactSolver(new ExactSettings { Workers = 1 }, new InsertionStart()).Solve(instance, options, null, default);
        var own = new ExactSolver(new ExactSettings { Workers = 1 }).Solve(instance, options, null, default);

        Assert.Equal(SolverStatus.Optimal, hinted.Status);
        Assert.StartsWith(said, (hinted.Notes ?? [])[0], StringComparison.Ordinal);
        Assert.Equal("construction (hint)", hinted.Trace[0].State);
        Assert.Equal(SolverStatus.Optimal, own.Status);
        Assert.DoesNotContain(own.Notes ?? [], n => n.StartsWith(said, StringComparison.Ordinal));
        Assert.Equal(PlanEvaluator.Evaluate(instance, own.Plan).Objective, PlanEvaluator.Evaluate(instance, hinted.Plan).Objective, 9);
    }

    [Fact]
    public void Exact_does_not_call_a_construction_that_breaks_hard_rules_its_hint()
    {
        // Stop b needs 150 kg, the one vehicle carries 100: the construction leaves it out (a hard rule broken), so it
        // is no hint, and CP-SAT, with no plan that keeps every rule, returns that construction, saying which it is.
        var instance = TinyInstances.Line([TinyInstances.Stop("a", 5), TinyInstances.Stop("b", 8, demand: 150)], [TinyInstances.Vehicle("v")], RuleSet.AllHard);
        var result = new ExactSolver(new ExactSettings { Workers = 1 }, new InsertionStart()).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(10) }, null, default);

        Assert.True(result.HasPlan);
        Assert.False(PlanEvaluator.Evaluate(instance, result.Plan).Feasible);
        Assert.NotEqual(SolverStatus.NoSolution, result.Status); // it holds a plan
        Assert.StartsWith("its plan is Anneal's construction, which breaks hard rules and so was not given to CP-SAT as a hint", (result.Notes ?? [])[0], StringComparison.Ordinal);
        Assert.Equal("construction", result.Trace[0].State);
    }

    private static PlanEvaluation Construction(Instance instance)
    {
        var state = InsertionSolver.Build(instance, new CandidateLists(instance, 30));
        Assert.True(state.Feasible, "the construction must be feasible for these tests");
        return PlanEvaluator.Evaluate(instance, state.ToPlan());
    }
}
