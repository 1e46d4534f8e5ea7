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
    public void Every_move_evaluation_with_pairs_and_returns_matches_the_exact_evaluator()
    {
        // Pair moves (both ends together) and every single-stop form, which may split or reorder a pair: the
        // evaluator then counts the break (rule `pair`), and the incremental evaluation must count it the same.
        int checkedMoves = 0;
        int broken = 0;
        PairCases.Array[250].Sample(all =>
        {
            foreach (var c in all)
            {
                checkedMoves += IncrementalEvaluationTests.CheckMoves(c, (Random rng, SearchState s, ref MoveDraft m) =>
                {
                    bool built = PairOrSingleMove(rng, s, ref m);
                    broken += built && s.Evaluate(ref m).FeasibleAfter == false && PairBreaksAfter(s, ref m) > 0 ? 1 : 0;
                    return built;
                });
            }
        }, seed: PairSeed, iter: 1, threads: 1);
        Assert.True(checkedMoves > 2000, $"only {checkedMoves} moves were checked");
        Assert.True(broken > 200, $"only {broken} moves left a broken pair, too few to tell whether breaks are counted");
    }

    private const string PairSeed = "Qx7mNc2Ra9Tb";

    private static readonly Gen<IncrementalEvaluationTests.Case> PairCases = IncrementalEvaluationTests.Cases.Select(c => c with { Pickups = true, Pairs = true });

    private static bool PairOrSingleMove(Random rng, SearchState s, ref MoveDraft m)
    {
        int n = s.StopCount;
        int u = rng.Next(n), v = rng.Next(n);
        switch (rng.Next(4))
        {
            case 0:
                int target = rng.Next(s.RouteCount);
                int gapC = rng.Next(s.Length(target) + 1);
                return PairMoveBuilder.Relocate(s, ref m, u, target, gapC, gapC + rng.Next(s.Length(target) - gapC + 1));
            case 1:
                return PairMoveBuilder.Exchange(s, ref m, u, v);
            default:
                return IncrementalEvaluationTests.RandomMove(rng, s, ref m);
        }
    }

    private static int PairBreaksAfter(SearchState s, ref MoveDraft m) =>
        s.Measure(ref m.A).PairBreaks + (m.RouteCount > 1 ? s.Measure(ref m.B).PairBreaks : 0);

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
