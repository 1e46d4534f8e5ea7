using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.OrTools;
using Anneal.Search.Construction;

namespace Anneal.Tests.OrTools;

/// <summary>
/// OR-Tools' own objective of the solution it returns (descaled) equals Anneal's evaluator on the same plan, part
/// by part and for lateness stop by stop, soft rules, optional stops and several windows per stop in play.
/// Integer data, so the scaling is exact up to the rounding of rates (at most one part in ten thousand per rate).
/// </summary>
public sealed class ObjectiveAgreementTests
{
    // A ceiling only: the runs end on their solution limit, which keeps them reproducible.
    private static readonly SolveOptions Options = new() { IterationLimit = 300, TimeLimit = TimeSpan.FromSeconds(60) };

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
        Assert.Contains(instance.Stops, s => s.Optional);
        var (engine, judged) = Agreeing(instance, Options);
        Parts(engine.Parts, judged.Breakdown, withTime: true);
    }

    [Theory]
    [InlineData(31)]
    [InlineData(32)]
    [InlineData(33)]
    public void SeveralSoftWindowsAgreePartByPartAndStopByStop(int seed)
    {
        var instance = TinyInstances.SeveralWindows(seed, 14, 2);
        var (engine, judged) = Agreeing(instance, Options with { IterationLimit = 100 });
        Parts(engine.Parts, judged.Breakdown, withTime: false);

        bool late = false, secondWindow = false;
        foreach (var route in judged.Routes)
        {
            for (int k = 0; k < route.Stops.Length; k++)
            {
                int s = route.Stops[k];
                var visit = route.Visits[k];
                Assert.True(Math.Abs(engine.Lateness[s] - visit.Late) <= 1e-6, $"stop {instance.Stops[s].Id}: OR-Tools late {engine.Lateness[s]}, Anneal {visit.Late}");
                late |= visit.Late > 0;
                secondWindow |= instance.Stops[s].Windows.Length > 1 && visit.Start >= instance.Stops[s].Windows[1].Open && visit.Late == 0;
            }
        }

        // The cases the mapping has to get right are present: a late stop and a stop served in its second window.
        Assert.True(late, "no stop is late in this plan; choose another seed");
        Assert.True(secondWindow, "no stop is served in its second window; choose another seed");
    }

    private static (EngineCost Engine, PlanEvaluation Judged) Agreeing(Instance instance, SolveOptions options)
    {
        var run = new OrToolsSolver(start: new InsertionStart()).Run(instance, options, null, default);
        Assert.True(run.Engine is not null && run.EnginePlan is not null, $"no OR-Tools solution ({run.RoutingStatus}): {string.Join("; ", run.Result.Notes ?? [])}");
        var judged = PlanEvaluator.Evaluate(instance, run.EnginePlan!);
        var engine = run.Engine!;
        Assert.Equal(engine.Reported, engine.Parts.Total, 6);
        Assert.True(Close(engine.Reported, judged.Objective), $"OR-Tools {engine.Reported}, evaluator {judged.Objective}");
        return (engine, judged);
    }

    private static void Parts(CostBreakdown engine, CostBreakdown anneal, bool withTime)
    {
        var pairs = new (string Name, double Engine, double Anneal)[]
        {
            ("fixed", engine.Fixed, anneal.Fixed), ("vehicles", engine.Vehicles, anneal.Vehicles), ("distance", engine.Distance, anneal.Distance),
            ("lateness", engine.Lateness, anneal.Lateness), ("overload", engine.Overload, anneal.Overload), ("overtime", engine.Overtime, anneal.Overtime),
            ("duration excess", engine.DurationExcess, anneal.DurationExcess), ("unserved", engine.Unserved, anneal.Unserved),
        };
        foreach (var (name, e, a) in pairs)
        {
            Assert.True(Close(e, a), $"{name}: OR-Tools {e}, evaluator {a}");
        }

        if (withTime)
        {
            Assert.True(Close(engine.Time, anneal.Time), $"time: OR-Tools {engine.Time}, evaluator {anneal.Time}");
        }
        else
        {
            Assert.Equal(0, anneal.Time);
        }
    }

    private static bool Close(double engine, double anneal) => Math.Abs(engine - anneal) <= 1e-5 * Math.Max(1, Math.Abs(anneal));
}
