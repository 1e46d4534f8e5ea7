using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.OrTools;
using Anneal.Core.Solving;

namespace Anneal.Tests.OrTools;

/// <summary>OR-Tools' own objective of its plan (descaled) equals Anneal's evaluator on it, soft rules and optional stops in play.</summary>
public sealed class ObjectiveAgreementTests
{
    [Theory]
    [InlineData(21, Objective.Cost)]
    [InlineData(22, Objective.Distance)]
    [InlineData(23, Objective.VehiclesThenDistance)]
    public void EngineObjectiveMatchesEvaluator(int seed, Objective objective)
    {
        var soft = new RuleSet
        {
            TimeWindows = Rule.Soft(3),
            Capacity = Rule.Soft(2),
            ShiftEnd = Rule.Soft(2),
            MaxDuration = Rule.Soft(1),
            Unserved = Rule.HardRule,
        };
        var instance = TinyInstances.Random(seed, 14, 3).With(objective: objective, rules: soft);
        var run = new OrToolsSolver().Run(instance, new SolveOptions { IterationLimit = 300, TimeLimit = TimeSpan.FromSeconds(2) }, null, default);
        Assert.NotNull(run.EngineObjective);
        var judged = PlanEvaluator.Evaluate(instance, run.Result.Plan);
        Assert.Contains(instance.Stops, s => s.Optional);

        // Integer data: the scaling is exact up to rounding of rates (at most one part in ten thousand per rate, far less here).
        double tolerance = 1e-5 * Math.Max(1, judged.Objective);
        Assert.True(Math.Abs(run.EngineObjective!.Value - judged.Objective) <= tolerance,
            $"OR-Tools {run.EngineObjective}, evaluator {judged.Objective}");
    }
}
