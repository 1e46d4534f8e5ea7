using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Search.Moves;
using Anneal.Search.Representation;
using CsCheck;

namespace Anneal.Tests.Search.Representation;

/// <summary>
/// Jobs with returns (stops that also collect, the goods riding to the depot): every move form evaluated through
/// <see cref="SearchState"/> agrees with PlanEvaluator (the truth, whose load follows the route stop by stop), by the
/// same CsCheck property as <see cref="IncrementalEvaluationTests"/> on instances where about half the stops collect;
/// and the drafted route's overload (the segment load data) equals the scheduler's at every draft.
/// </summary>
public sealed class PickupMoveEvaluationTests
{
    private const string MoveSeed = "Pk3vRt8Lw2Qz";

    private static readonly Gen<IncrementalEvaluationTests.Case> Cases = IncrementalEvaluationTests.Cases.Select(c => c with { Pickups = true });

    [Fact]
    public void Every_move_evaluation_with_returns_matches_the_exact_evaluator()
    {
        int checkedMoves = 0;
        // One sample of many cases from a fixed seed: CsCheck draws only the first iteration from the given seed, so
        // iterations of their own would make the run differ from run to run.
        Cases.Array[150].Sample(all =>
        {
            foreach (var c in all)
            {
                checkedMoves += IncrementalEvaluationTests.CheckMoves(c);
            }
        }, seed: MoveSeed, iter: 1, threads: 1);
        Assert.True(checkedMoves > 2000, $"only {checkedMoves} moves were checked");
    }

    [Fact]
    public void Drafted_overload_with_returns_matches_the_scheduler_where_the_route_total_would_not()
    {
        int midRoute = 0;
        for (int seed = 0; seed < 40; seed++)
        {
            var rng = new Random(5000 + seed);
            var instance = RandomInstances.Create(rng, rng.Next(5, 18), 3, hardWindows: true, dims: 1 + (seed % 3), heterogeneous: true, pickups: true);
            var state = new SearchState(instance, PenaltyWeights.Uniform(1));
            Assert.True(state.FastPath);
            state.Load(IncrementalEvaluationTests.RandomPlan(rng, instance));
            for (int step = 0; step < 100; step++)
            {
                var move = default(MoveDraft);
                if (!IncrementalEvaluationTests.RandomMove(rng, state, ref move) || move.RouteCount == 0)
                {
                    continue;
                }

                var fast = state.Measure(ref move.A);
                state.Apply(ref move);
                var stops = state.Route(move.A.Route);
                var exact = RouteScheduler.Measure(instance, move.A.Route, stops);
                Assert.Equal(exact.Overload, fast.Overload, 6);
                Assert.Equal(exact.Distance, fast.Distance, 6);
                midRoute += TotalWouldMisjudge(instance, move.A.Route, stops, exact.Overload) ? 1 : 0;
            }
        }

        // A test where the route total would have done as well could not fail for the reason it is there.
        Assert.True(midRoute > 200, $"only {midRoute} drafts had an overload that the route total would misjudge");
    }

    // What a delivery-only measure (the route's total demand against capacity) would say; differing from it is
    // what makes a draft tell the load along the route from the route total.
    private static bool TotalWouldMisjudge(Instance instance, int vehicle, ReadOnlySpan<int> stops, double overload)
    {
        double total = 0;
        for (int d = 0; d < instance.DimensionCount; d++)
        {
            double sum = 0;
            foreach (int s in stops)
            {
                sum += instance.Demand(s, d);
            }

            total += Math.Max(0, sum - instance.Capacity(vehicle, d));
        }

        return Math.Abs(total - overload) > 1e-9;
    }
}
