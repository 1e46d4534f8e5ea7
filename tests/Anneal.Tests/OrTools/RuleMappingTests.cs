using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.OrTools;
using Anneal.Core.Solving;
using static Anneal.Tests.Fixtures.TinyInstances;

namespace Anneal.Tests.OrTools;

/// <summary>
/// One tiny instance per rule where the rule binds: OR-Tools (restoring the plan into its model) and Anneal's
/// evaluator give the same verdict on a plan that breaks it and on one that keeps it. Depot at 0, stops on a line,
/// travel time = distance.
/// </summary>
public sealed class RuleMappingTests
{
    private static readonly Plan Together = new([new PlannedRoute(0, [0, 1])]);
    private static readonly Plan Apart = new([new PlannedRoute(0, [0]), new PlannedRoute(1, [1])]);

    [Fact]
    public void Capacity()
    {
        var instance = Line([Stop("a", 10, demand: 6), Stop("b", -10, demand: 6)], [Vehicle("v1", capacity: 10), Vehicle("v2", capacity: 10)], RuleSet.AllHard);
        SameVerdict(instance, Together, false);
        SameVerdict(instance, Apart, true);
    }

    [Fact]
    public void HardTimeWindow()
    {
        // a then b: b reached at 10 + 20 = 30, after its close at 20.
        var instance = Line([Stop("a", 10, close: 20), Stop("b", -10, close: 20)], [Vehicle("v1"), Vehicle("v2")], RuleSet.AllHard);
        SameVerdict(instance, Together, false);
        SameVerdict(instance, Apart, true);
    }

    [Fact]
    public void SoftTimeWindow()
    {
        var rules = RuleSet.AllHard with { TimeWindows = Rule.Soft(2) };
        var instance = Line([Stop("a", 10, close: 20), Stop("b", -10, close: 20)], [Vehicle("v1")], rules);
        SameVerdict(instance, Together, true);
        var judged = SameObjective(instance);
        Assert.Equal(20, judged.Breakdown.Lateness, 6); // 10 late at 2 per minute
    }

    [Fact]
    public void ShiftEnd()
    {
        var instance = Line([Stop("a", 10), Stop("b", -10)], [Vehicle("v1", shiftEnd: 35), Vehicle("v2", shiftEnd: 35)], RuleSet.AllHard);
        SameVerdict(instance, Together, false); // back at 40
        SameVerdict(instance, Apart, true);
    }

    [Fact]
    public void MaxDuration()
    {
        var instance = Line([Stop("a", 10), Stop("b", -10)], [Vehicle("v1", maxDuration: 30), Vehicle("v2", maxDuration: 30)], RuleSet.AllHard);
        SameVerdict(instance, Together, false); // lasts 40
        SameVerdict(instance, Apart, true);
    }

    [Fact]
    public void Equipment()
    {
        var instance = Line([Stop("a", 10), Stop("b", -10, needs: 1)], [Vehicle("v1"), Vehicle("v2", equipment: 1)], RuleSet.AllHard);
        SameVerdict(instance, Together, false); // v1 lacks the equipment b needs
        SameVerdict(instance, Apart, true);
    }

    [Fact]
    public void OptionalStop()
    {
        // b is optional at 5 and 200 away and back: leaving it out is cheaper, and both count the 5.
        var instance = Line([Stop("a", 10), Stop("b", -100, optional: true, penalty: 5)], [Vehicle("v1")], RuleSet.AllHard);
        var judged = SameObjective(instance);
        Assert.Equal([1], judged.Unserved);
        Assert.Equal(25, judged.Objective, 6);

        var mandatory = Line([Stop("a", 10), Stop("b", -100)], [Vehicle("v1")], RuleSet.AllHard);
        SameVerdict(mandatory, new Plan([new PlannedRoute(0, [0])]), false);
    }

    [Fact]
    public void FixedCost()
    {
        var instance = Line([Stop("a", 10)], [Vehicle("v1", fixedCost: 100), Vehicle("v2", fixedCost: 30)], RuleSet.AllHard, Objective.Cost);
        var judged = SameObjective(instance);
        Assert.Equal(1, judged.Routes.Single(r => r.Stops.Length > 0).Vehicle);
        Assert.Equal(50, judged.Objective, 6); // 30 fixed + 20 distance at 1 per unit
    }

    /// <summary>The plan restores into OR-Tools' model exactly when the evaluator finds it feasible.</summary>
    private static void SameVerdict(Instance instance, Plan plan, bool feasible)
    {
        Assert.Equal(feasible, PlanEvaluator.Evaluate(instance, plan).Feasible);
        using var mapping = RoutingModelBuilder.Build(instance);
        var restored = mapping.Model.ReadAssignmentFromRoutes(mapping.ToRoutes(plan), true);
        Assert.Equal(feasible, restored is not null);
    }

    /// <summary>OR-Tools' plan and objective, judged by the evaluator: feasible, same cost.</summary>
    private static PlanEvaluation SameObjective(Instance instance)
    {
        var run = new OrToolsSolver().Run(instance, new SolveOptions { IterationLimit = 50, TimeLimit = TimeSpan.FromSeconds(60) }, null, default); // a ceiling: it ends on the solution limit
        var judged = PlanEvaluator.Evaluate(instance, run.Result.Plan);
        Assert.True(judged.Feasible);
        Assert.Equal(judged.Objective, run.EngineObjective!.Value, 6);
        return judged;
    }
}
