using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Moves;
using Anneal.Search.Representation;
using CsCheck;

namespace Anneal.Tests.Search.Representation;

/// <summary>
/// Every incremental move evaluation (<see cref="MoveEvaluator"/>, reached through <see cref="SearchState"/> as the
/// solvers reach it) agrees with the exact evaluator (PlanEvaluator, the truth): a CsCheck property over random
/// instances (hard or soft, single or several windows, one to three dimensions, equal or mixed vehicles), random
/// plans and random moves: same penalized and objective change to 1e-6, the same feasibility, and the same for the
/// by-rule parts and the one-route feasible change.
/// </summary>
public sealed class IncrementalEvaluationTests
{
    // CsCheck's seed fixes only the first sampled case (the others are drawn afresh on every run), so the suite walks
    // a fixed stream of cases from this seed itself; ANNEAL_PROPERTY_CASES=N samples N more at random through
    // CsCheck (which shrinks a failure and prints its seed) for a long run.
    private const string MoveSeed = "7k2QpLm9Xa1B";
    private const int FixedCases = 200;

    internal sealed record Case(int Seed, bool HardWindows, bool MultiWindows, int Dims, bool Heterogeneous, int Stops, int Vehicles, bool Pickups = false, bool Pairs = false, bool Stability = false);

    internal delegate bool MoveMaker(Random rng, SearchState s, ref MoveDraft m);

    internal static readonly Gen<Case> Cases =
        Gen.Select(Gen.Int[0, 1_000_000], Gen.Bool, Gen.Bool, Gen.Int[1, 3], Gen.Bool, Gen.Int[6, 22], Gen.Int[2, 4],
            (seed, hard, multi, dims, mixed, stops, vehicles) => new Case(seed, hard, multi, dims, mixed, stops, vehicles));

    [Fact]
    public void Every_move_evaluation_matches_the_exact_evaluator()
    {
        int checkedMoves = 0;
        var pcg = PCG.Parse(MoveSeed);
        for (int i = 0; i < FixedCases; i++)
        {
            var c = Cases.Generate(pcg, null, out _);
            try
            {
                checkedMoves += CheckMoves(c);
            }
            catch (Exception e)
            {
                throw new Xunit.Sdk.XunitException($"case {i} of the fixed stream, {c}: {e.Message}", e);
            }
        }

        Assert.True(checkedMoves > 3000, $"only {checkedMoves} moves were checked");
        if (int.TryParse(Environment.GetEnvironmentVariable("ANNEAL_PROPERTY_CASES"), out int more) && more > 0)
        {
            Cases.Sample(c => CheckMoves(c), iter: more, threads: 1);
        }
    }

    /// <summary>
    /// The case that failed on a fresh clone (bb21722): asked for several windows, its twelve stops all drew one, so
    /// the instance rightly took the segment fast path and the check that it would not failed. The generator now
    /// gives such an instance a second window; before that change this test failed as the clone's run did.
    /// </summary>
    [Fact]
    public void Once_failing_case_480430_hard_multi_windows_mixed_fleet()
    {
        var c = new Case(480430, HardWindows: true, MultiWindows: true, Dims: 1, Heterogeneous: true, Stops: 12, Vehicles: 4);
        int n = CheckMoves(c);
        Assert.True(n > 20, $"only {n} moves were checked");
    }

    /// <summary>
    /// A case the long random run found (ANNEAL_PROPERTY_CASES=20000): a relocation left a route whose measures keep
    /// every hard window while PlanEvaluator's visit times made a stop 65.9 late, because the scheduler's second pass
    /// took a later window after a rounding of the delayed departure (see DelayedDepartureTests).
    /// </summary>
    [Fact]
    public void Once_failing_case_339725_delayed_departure_past_a_window_close()
    {
        int n = CheckMoves(new Case(339725, HardWindows: true, MultiWindows: true, Dims: 3, Heterogeneous: true, Stops: 7, Vehicles: 3));
        Assert.True(n > 10, $"only {n} moves were checked");
    }

    /// <summary>
    /// Issue 24: in a re-plan every move is priced by the stability rule too (a stop on another vehicle than planned,
    /// a start moved beyond the tolerance), so the search prefers stable plans. The same fixed stream of cases as above,
    /// each with most stops planned.
    /// </summary>
    [Fact]
    public void Every_move_evaluation_matches_the_exact_evaluator_with_stability_prices()
    {
        int checkedMoves = 0;
        var pcg = PCG.Parse(MoveSeed);
        for (int i = 0; i < 60; i++)
        {
            var c = Cases.Generate(pcg, null, out _) with { Stability = true };
            try
            {
                checkedMoves += CheckMoves(c);
            }
            catch (Exception e)
            {
                throw new Xunit.Sdk.XunitException($"case {i} of the fixed stream, {c}: {e.Message}", e);
            }
        }

        Assert.True(checkedMoves > 1000, $"only {checkedMoves} moves were checked");
    }

    /// <summary>Most stops get a planned vehicle and start, as in a re-plan's residual day; prices high enough to matter.</summary>
    private static Instance WithPlannedStops(Instance instance, Random rng)
    {
        var stops = new List<Stop>(instance.StopCount);
        foreach (var s in instance.Stops)
        {
            bool planned = rng.NextDouble() < 0.8;
            stops.Add(s with
            {
                PlannedVehicle = planned ? rng.Next(instance.Vehicles.Count) : -1,
                PlannedStart = planned && rng.NextDouble() < 0.9 ? Math.Round(rng.NextDouble() * 600) : double.NaN,
            });
        }

        var rules = instance.Rules with { Stability = new StabilityPrices(25, 1.5, 10) };
        return new Instance(instance.Name, stops, instance.Depots, instance.Vehicles, instance.DimensionNames, instance.EquipmentNames, rules, instance.Objective,
            instance.Travel, instance.Units) { LatLon = instance.LatLon };
    }

    internal static int CheckMoves(Case c, MoveMaker? makeMove = null)
    {
        int checkedMoves = 0;
        var rng = new Random(c.Seed);
        var instance = RandomInstances.Create(rng, c.Stops, c.Vehicles, c.HardWindows, c.MultiWindows, c.Dims, c.Heterogeneous, c.Pickups, c.Pairs);
        if (c.Stability)
        {
            instance = WithPlannedStops(instance, rng);
            Assert.True(instance.Costs.PricesStability);
        }

        var weights = new PenaltyWeights { TimeWindow = 3.5, Capacity = 7, Overtime = 2, Duration = 1.5, Equipment = 50, Unserved = 1000 };
        var state = new SearchState(instance, weights);
        Assert.Equal(c.HardWindows && instance.SingleWindows && !c.Stability, state.FastPath);
        state.Load(RandomPlan(rng, instance));
        for (int step = 0; step < 60; step++)
        {
            var move = default(MoveDraft);
            if (!(makeMove ?? RandomMove)(rng, state, ref move))
            {
                continue;
            }

            double before = PlanEvaluator.Penalized(instance, state.ToPlan(), weights);
            double objectiveBefore = PlanEvaluator.Evaluate(instance, state.ToPlan()).Objective;
            var effect = state.Evaluate(ref move);
            double delta = effect.Penalized;
            var parts = state.EvaluateParts(ref move);
            bool partsFeasible = state.FeasibleAfter(parts);
            bool opens = state.OpensRoute(ref move);
            bool empties = state.EmptiesRoute(ref move);
            int usedBefore = state.ToPlan().VehiclesUsed;
            double routeBefore = RouteObjective(PlanEvaluator.Evaluate(instance, state.ToPlan()), move.A.Route);
            bool routeKeepsRules = state.FeasibleChange(ref move.A, out double routeChange);
            state.Apply(ref move);
            var plan = state.ToPlan();
            Assert.Equal(empties, parts.EmptiesRoute);
            Assert.Equal(opens, parts.OpensRoute);
            Assert.Equal((opens ? 1 : 0) - (empties ? 1 : 0), plan.VehiclesUsed - usedBefore);
            var truth = PlanEvaluator.Evaluate(instance, plan);
            double after = PlanEvaluator.Penalized(instance, plan, weights);
            double tolerance = 1e-6 * Math.Max(1, Math.Abs(before));
            var routeTruth = truth.Routes.FirstOrDefault(r => r.Vehicle == move.A.Route);
            Assert.Equal(routeTruth?.Feasible ?? true, routeKeepsRules);
            if (routeKeepsRules)
            {
                Assert.True(Math.Abs(RouteObjective(truth, move.A.Route) - routeBefore - routeChange) <= tolerance,
                    $"{c} step {step} {move.Kind}: route change {routeChange}, exact {RouteObjective(truth, move.A.Route) - routeBefore}");
            }

            Assert.True(Math.Abs(after - before - delta) <= tolerance,
                $"{c} step {step} {move.Kind}: incremental delta {delta}, exact {after - before}");
            Assert.True(Math.Abs(truth.Objective - objectiveBefore - effect.Objective) <= tolerance,
                $"{c} step {step} {move.Kind}: objective delta {effect.Objective}, exact {truth.Objective - objectiveBefore}");
            Assert.Equal(truth.Feasible, effect.FeasibleAfter);
            Assert.True(Math.Abs(parts.Penalized(weights) - delta) <= tolerance, $"{move.Kind}: parts {parts.Penalized(weights)} vs delta {delta}");
            Assert.True(Math.Abs(parts.Objective - effect.Objective) <= tolerance, "parts objective differs");
            Assert.Equal(truth.Feasible, partsFeasible);
            Assert.Equal(truth.Feasible, parts.FeasibleAfter);
            Assert.Equal(truth.Feasible, state.Feasible);
            Assert.True(Math.Abs(state.Penalized - after) <= tolerance, "running penalized total drifted");
            Assert.True(Math.Abs(state.Objective - truth.Objective) <= tolerance, "running objective total drifted");
            checkedMoves++;
        }

        return checkedMoves;
    }

    [Fact]
    public void DraftMeasuresMatchScheduler()
    {
        // The segment summaries must reproduce every measure, not only the total cost.
        for (int seed = 0; seed < 30; seed++)
        {
            var rng = new Random(1000 + seed);
            var instance = RandomInstances.Create(rng, rng.Next(5, 18), 3, hardWindows: true, dims: 2, heterogeneous: true);
            var state = new SearchState(instance, PenaltyWeights.Uniform(1));
            state.Load(RandomPlan(rng, instance));
            for (int step = 0; step < 100; step++)
            {
                var move = default(MoveDraft);
                if (!RandomMove(rng, state, ref move) || move.RouteCount == 0)
                {
                    continue;
                }

                var fast = state.Measure(ref move.A);
                state.Apply(ref move);
                var exact = RouteScheduler.Measure(instance, move.A.Route, state.Route(move.A.Route));
                Assert.Equal(exact.Distance, fast.Distance, 6);
                Assert.Equal(exact.Duration, fast.Duration, 6);
                Assert.Equal(exact.TimeWindowViolation, fast.TimeWindowViolation, 6);
                Assert.Equal(exact.Overtime, fast.Overtime, 6);
                Assert.Equal(exact.DurationExcess, fast.DurationExcess, 6);
                Assert.Equal(exact.Overload, fast.Overload, 6);
                Assert.Equal(exact.MissingEquipment, fast.MissingEquipment);
                if (exact.StopCount > 0)
                {
                    Assert.Equal(exact.Return, fast.Return, 6);
                }
            }
        }
    }

    private static double RouteObjective(PlanEvaluation evaluation, int vehicle) =>
        evaluation.Routes.FirstOrDefault(r => r.Vehicle == vehicle)?.Objective ?? 0;

    internal static Plan RandomPlan(Random rng, Instance instance)
    {
        var lists = new List<int>[instance.Vehicles.Count];
        for (int v = 0; v < lists.Length; v++)
        {
            lists[v] = [];
        }

        var order = Enumerable.Range(0, instance.StopCount).OrderBy(_ => rng.Next()).ToArray();
        foreach (int s in order)
        {
            if (rng.Next(8) == 0)
            {
                continue; // unserved
            }

            lists[rng.Next(lists.Length)].Add(s);
        }

        return new Plan(lists.Select((l, v) => new PlannedRoute(v, l.ToArray())).Where(r => r.Stops.Length > 0).ToArray());
    }

    internal static bool RandomMove(Random rng, SearchState s, ref MoveDraft m)
    {
        int n = s.StopCount;
        int u = rng.Next(n), v = rng.Next(n);
        switch (rng.Next(9))
        {
            case 0: return MoveBuilder.Relocate(s, ref m, u, v, rng.Next(2) == 0);
            case 1: return MoveBuilder.Relocate(s, ref m, u, v, rng.Next(2) == 0, chain: rng.Next(2, 4));
            case 2: return MoveBuilder.Exchange(s, ref m, u, v);
            case 3: return MoveBuilder.Exchange(s, ref m, u, v, rng.Next(1, 4), rng.Next(1, 4));
            case 4: return MoveBuilder.TwoOptStar(s, ref m, u, v, rng.Next(2) == 0);
            case 5: return MoveBuilder.TwoOpt(s, ref m, u, v);
            case 6: return MoveBuilder.Drop(s, ref m, u);
            case 7:
                int empty = Enumerable.Range(0, s.RouteCount).FirstOrDefault(r => s.Length(r) == 0, -1);
                return s.RouteOf(u) < 0
                    ? MoveBuilder.Insert(s, ref m, u, empty >= 0 && rng.Next(3) == 0 ? -1 : v, rng.Next(2) == 0, empty)
                    : empty >= 0 && MoveBuilder.ToEmptyRoute(s, ref m, u, empty);
            default: return MoveBuilder.Insert(s, ref m, u, v, rng.Next(2) == 0);
        }
    }
}
