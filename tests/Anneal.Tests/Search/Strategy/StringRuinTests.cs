using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;
using Anneal.Search.Strategy;

namespace Anneal.Tests.Search.Strategy;

/// <summary>
/// The string ruin is a compound move: whatever it keeps must agree with the exact evaluator (PlanEvaluator, the
/// truth), keep to the hard rules and open no route; whatever it refuses must leave the plan exactly as it was.
/// </summary>
public sealed class StringRuinTests
{
    // Solomon rc101 (Solomon 1987), read from ../shared/benchmarks: hard windows, segment concatenation.
    [SkippableFact]
    public void KeptChangesMatchTheExactEvaluatorAndRefusedOnesLeaveThePlanAlone()
    {
        var instance = SolomonReader.Parse(File.ReadAllText(BenchmarkData.File("solomon/rc101.txt")), "rc101.txt")
            .With(objective: Objective.VehiclesThenDistance);
        var checkedAttempts = Check(instance, seed: 11, attempts: 400, temperature: 20);
        Assert.True(checkedAttempts.Kept > 20 && checkedAttempts.Refused > 20, $"kept {checkedAttempts.Kept}, refused {checkedAttempts.Refused}");
    }

    // Random instances with soft windows, several windows per stop and several dimensions: the exact forward pass
    // and the undo of routes that traded stops.
    [Fact]
    public void RandomInstancesWithSoftAndSeveralWindowsAgreeWithTheExactEvaluator()
    {
        int attempts = 0;
        for (int seed = 0; seed < 30; seed++)
        {
            var rng = new Random(500 + seed);
            var instance = RandomInstances.Create(rng, rng.Next(8, 30), rng.Next(3, 6), hardWindows: seed % 3 == 0, multiWindows: seed % 2 == 0, dims: 1 + (seed % 3), heterogeneous: seed % 2 == 1);
            attempts += Check(instance, seed, attempts: 60, temperature: 1 + (seed % 5)).Kept;
        }

        Assert.True(attempts > 100, $"only {attempts} changes were kept");
    }

    // With zero temperature only improvements are kept: from the constructed rc101 plan the objective never rises.
    [SkippableFact]
    public void AtZeroTemperatureTheObjectiveNeverRises()
    {
        var instance = SolomonReader.Parse(File.ReadAllText(BenchmarkData.File("solomon/rc101.txt")), "rc101.txt");
        var candidates = new CandidateLists(instance, 30);
        var state = InsertionSolver.Build(instance, candidates);
        var ruin = new StringRuin(state, candidates, new SearchRandom(2));
        double start = state.Objective;
        double previous = start;
        for (int k = 0; k < 500; k++)
        {
            ruin.Attempt(0);
            Assert.True(state.Objective <= previous + 1e-9);
            previous = state.Objective;
        }

        Assert.True(previous < start, "500 attempts improved nothing on the constructed plan");
    }

    private static (int Kept, int Refused) Check(Instance instance, int seed, int attempts, double temperature)
    {
        var candidates = new CandidateLists(instance, 10);
        var state = InsertionSolver.Build(instance, candidates);
        if (!state.Feasible)
        {
            return (0, 0);
        }

        var ruin = new StringRuin(state, candidates, new SearchRandom(seed));
        int kept = 0, refused = 0;
        for (int k = 0; k < attempts; k++)
        {
            string before = Routes(state.ToPlan());
            int usedBefore = state.UsedRoutes;
            if (ruin.Attempt(temperature))
            {
                kept++;
            }
            else
            {
                refused++;
                Assert.Equal(before, Routes(state.ToPlan()));
            }

            var truth = PlanEvaluator.Evaluate(instance, state.ToPlan());
            Assert.True(truth.Feasible, string.Join("; ", truth.Violations.Where(v => v.Hard).Select(v => v.Message)));
            Assert.True(Math.Abs(truth.Objective - state.Objective) <= 1e-6 * Math.Max(1, truth.Objective),
                $"seed {seed} attempt {k}: running objective {state.Objective}, exact {truth.Objective}");
            Assert.True(state.UsedRoutes <= usedBefore, "a route was opened");
            Assert.Equal(instance.StopCount, state.ToPlan().Routes.Sum(r => r.Stops.Length) + state.UnservedCount);
        }

        return (kept, refused);
    }

    private static string Routes(Plan plan) => string.Join("|", plan.Routes.Select(r => $"{r.Vehicle}:{string.Join(",", r.Stops)}"));
}
