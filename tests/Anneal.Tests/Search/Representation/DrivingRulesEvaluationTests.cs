using Anneal.Core.DrivingRules;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Search.Moves;
using Anneal.Search.Representation;
using CsCheck;

namespace Anneal.Tests.Search.Representation;

/// <summary>
/// With driving rules the move evaluator measures a vehicle's drafted route by the scheduler, breaks and all, and must
/// agree with the exact evaluator (PlanEvaluator): a CsCheck property over random instances whose vehicles work under
/// random rule sets (short limits, so breaks, split breaks, counted waits and breaches all occur), some under none,
/// hard or soft, on random plans and moves. Same penalized and objective change to 1e-6, same feasibility, same parts.
/// </summary>
public sealed class DrivingRulesEvaluationTests
{
    private const string MoveSeed = "dR1vEhoUrs22";

    private sealed record Case(int Seed, bool HardWindows, bool Soft, int Stops, int Vehicles);

    private static readonly Gen<Case> Cases =
        Gen.Select(Gen.Int[0, 1_000_000], Gen.Bool, Gen.Bool, Gen.Int[6, 18], Gen.Int[2, 4],
            (seed, hard, soft, stops, vehicles) => new Case(seed, hard, soft, stops, vehicles));

    private static Instance WithRules(Random rng, Instance instance, bool soft)
    {
        var fleet = instance.Vehicles.Select((v, k) => k == 0 && rng.Next(2) == 0 ? v : v with
        {
            DrivingRules = new DrivingRuleSet
            {
                Name = "random-" + k,
                DrivingBeforeBreak = rng.Next(40, 130),
                BreakMinutes = rng.Next(10, 30),
                SplitFirst = rng.Next(2) == 0 ? 0 : 4,
                SplitSecond = 0,
                DailyDriving = rng.Next(150, 450),
                DutySpan = rng.Next(250, 700),
                WaitingCounts = rng.Next(2) == 0,
                Rule = soft && rng.Next(2) == 0 ? Rule.Soft(rng.Next(1, 5)) : Rule.HardRule,
            },
        }).Select(v => v.DrivingRules is { SplitFirst: > 0 } r ? v with { DrivingRules = r with { SplitSecond = r.BreakMinutes - 4 } } : v).ToList();
        return instance.With(vehicles: fleet);
    }

    [Fact]
    public void Every_move_evaluation_matches_the_exact_evaluator_under_driving_rules()
    {
        // A fixed stream of cases from the seed (CsCheck's own seed fixes only the first sampled case), as
        // IncrementalEvaluationTests walks it; ANNEAL_PROPERTY_CASES=N samples N more at random for a long run.
        int checkedMoves = 0, withBreaks = 0;
        var pcg = PCG.Parse(MoveSeed);
        for (int i = 0; i < 100; i++)
        {
            var c = Cases.Generate(pcg, null, out _);
            try
            {
                var (moves, breaks) = CheckMoves(c);
                checkedMoves += moves;
                withBreaks += breaks;
            }
            catch (Exception e)
            {
                throw new Xunit.Sdk.XunitException($"case {i} of the fixed stream, {c}: {e.Message}", e);
            }
        }

        if (int.TryParse(Environment.GetEnvironmentVariable("ANNEAL_PROPERTY_CASES"), out int more) && more > 0)
        {
            Cases.Sample(c => CheckMoves(c), iter: more, threads: 1);
        }

        Assert.True(checkedMoves > 1000, $"only {checkedMoves} moves were checked");
        Assert.True(withBreaks > 400, $"only {withBreaks} plans had breaks");
    }

    private static (int Moves, int WithBreaks) CheckMoves(Case c)
    {
        int checkedMoves = 0, withBreaks = 0;
        var rng = new Random(c.Seed);
        var instance = WithRules(rng, RandomInstances.Create(rng, c.Stops, c.Vehicles, c.HardWindows), c.Soft);
        var weights = new PenaltyWeights { TimeWindow = 3.5, Capacity = 7, Overtime = 2, Duration = 1.5, Equipment = 50, Unserved = 1000 };
        var state = new SearchState(instance, weights);
        state.Load(IncrementalEvaluationTests.RandomPlan(rng, instance));
        for (int step = 0; step < 40; step++)
        {
            var move = default(MoveDraft);
            if (!IncrementalEvaluationTests.RandomMove(rng, state, ref move))
            {
                continue;
            }

            double before = PlanEvaluator.Penalized(instance, state.ToPlan(), weights);
            double objectiveBefore = PlanEvaluator.Evaluate(instance, state.ToPlan()).Objective;
            var effect = state.Evaluate(ref move);
            var parts = state.EvaluateParts(ref move);
            bool partsFeasible = state.FeasibleAfter(parts);
            state.Apply(ref move);
            var truth = PlanEvaluator.Evaluate(instance, state.ToPlan());
            double after = PlanEvaluator.Penalized(instance, state.ToPlan(), weights);
            double tolerance = 1e-6 * Math.Max(1, Math.Abs(before));
            Assert.True(Math.Abs(after - before - effect.Penalized) <= tolerance,
                $"{c} step {step} {move.Kind}: incremental delta {effect.Penalized}, exact {after - before}");
            Assert.True(Math.Abs(truth.Objective - objectiveBefore - effect.Objective) <= tolerance,
                $"{c} step {step} {move.Kind}: objective delta {effect.Objective}, exact {truth.Objective - objectiveBefore}");
            Assert.Equal(truth.Feasible, effect.FeasibleAfter);
            Assert.True(Math.Abs(parts.Penalized(weights) - effect.Penalized) <= tolerance, $"{move.Kind}: parts {parts.Penalized(weights)} vs delta {effect.Penalized}");
            Assert.Equal(truth.Feasible, partsFeasible);
            Assert.Equal(truth.Feasible, state.Feasible);
            Assert.True(Math.Abs(state.Objective - truth.Objective) <= tolerance, "running objective total drifted");
            withBreaks += truth.Routes.Any(r => r.Breaks.Count > 0) ? 1 : 0;
            checkedMoves++;
        }

        return (checkedMoves, withBreaks);
    }
}
