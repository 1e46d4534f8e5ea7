using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;

namespace Anneal.Tests.Core.Evaluation;

/// <summary>
/// The order of plans on hand-made jobs (TinyJob: A 30 kg, B 40 kg, C 20 kg; two vans). Every verdict comes from the
/// evaluator; the expected order is the documented one (README, "Which plan is written"), checked by hand.
/// </summary>
public class PlanRankingTests
{
    // Vans of 50 kg: A + C (50 kg) fit one van, A + B + C (90 kg) is 40 kg over, A + B (70 kg) 20 kg over.
    private static readonly Instance Small = TinyJob.Create(capacityKg: 50);

    private static PlanEvaluation Judge(Instance instance, params int[][] routes)
    {
        var planned = new List<PlannedRoute>();
        for (int v = 0; v < routes.Length; v++)
        {
            planned.Add(new PlannedRoute(v, routes[v]));
        }

        return PlanEvaluator.Evaluate(instance, new Plan(planned));
    }

    [Fact]
    public void Any_plan_beats_no_plan_even_one_that_serves_nothing()
    {
        var nothing = Judge(Small);
        Assert.False(nothing.Feasible);
        Assert.True(PlanRanking.IsBetter(nothing, null));
        Assert.False(PlanRanking.IsBetter(null, nothing));
        Assert.Equal(1, PlanRanking.Best([null, nothing, null]));
    }

    [Fact]
    public void A_plan_keeping_every_hard_rule_beats_a_cheaper_one_that_breaks_one()
    {
        var feasible = Judge(Small, [0, 2], [1]);   // two vans, 50 kg and 40 kg
        var overloaded = Judge(Small, [0, 1, 2]);    // one van, cheaper, 40 kg over
        Assert.True(feasible.Feasible);
        Assert.True(overloaded.Objective < feasible.Objective);
        Assert.True(PlanRanking.IsBetter(feasible, overloaded));
    }

    [Fact]
    public void Among_infeasible_plans_more_stops_served_on_drivable_routes_comes_first()
    {
        var crammed = Judge(Small, [0, 1, 2]);      // every stop on one van, 40 kg over: none of them can be driven as planned
        var leftOver = Judge(Small, [0], [1]);      // A and B on drivable routes, C on no route
        Assert.Equal((3, 40), PlanRanking.HardBreaks(crammed));
        Assert.Equal((1, 0), PlanRanking.HardBreaks(leftOver));
        Assert.True(PlanRanking.IsBetter(leftOver, crammed));
    }

    [Fact]
    public void Then_the_smaller_hard_excess_even_at_a_higher_objective()
    {
        var moreOver = Judge(Small, [0, 1], [2]);   // A + B: 70 kg, 20 over; C alone
        var lessOver = Judge(Small, [0], [1, 2]);   // B + C: 60 kg, 10 over; A alone
        Assert.Equal((2, 20), PlanRanking.HardBreaks(moreOver));
        Assert.Equal((2, 10), PlanRanking.HardBreaks(lessOver));
        Assert.True(lessOver.Objective > moreOver.Objective);
        Assert.True(PlanRanking.IsBetter(lessOver, moreOver));
    }

    [Fact]
    public void Then_the_lower_objective_even_over_a_longer_distance()
    {
        var roomy = TinyJob.Create(); // 100 kg vans: one van can take every stop
        var oneVan = Judge(roomy, [0, 1, 2]);
        var twoVans = Judge(roomy, [0, 2], [1]);
        var swapped = Judge(roomy, [1], [0, 2]);    // the same routes on the other vans: the same cost
        Assert.True(oneVan.Feasible && twoVans.Feasible);
        Assert.True(oneVan.Objective < twoVans.Objective); // one fixed cost of 50 fewer
        Assert.True(PlanRanking.IsBetter(oneVan, twoVans));
        Assert.Equal(0, PlanRanking.Compare(twoVans, swapped));
        Assert.True(PlanRanking.IsBetter(Made(distance: 50, duration: 60, objective: 100), Made(distance: 10, duration: 20, objective: 120)));
    }

    [Fact]
    public void An_objective_that_cannot_tell_plans_apart_falls_back_to_distance()
    {
        // No prices at all: every plan costs 0 (the case of a cost objective without prices).
        var roomy = TinyJob.Create();
        var free = roomy.With(vehicles: [.. roomy.Vehicles.Select(v => v with { FixedCost = 0, CostPerDistance = 0, CostPerHour = 0 })]);
        var shortTrip = Judge(free, [0, 1, 2]);     // 21.7 km
        var detour = Judge(free, [0, 2], [1]);      // 33.2 km
        Assert.Equal(0, shortTrip.Objective);
        Assert.Equal(0, detour.Objective);
        Assert.True(shortTrip.Distance < detour.Distance);
        Assert.True(PlanRanking.IsBetter(shortTrip, detour));
        Assert.False(PlanRanking.IsBetter(detour, shortTrip));
    }

    [Fact]
    public void Equal_objective_and_distance_falls_back_to_duration()
    {
        var quick = Made(distance: 10, duration: 30);
        var slow = Made(distance: 10, duration: 45);
        Assert.True(PlanRanking.IsBetter(quick, slow));
        Assert.Equal(0, PlanRanking.Compare(quick, Made(distance: 10, duration: 30)));
    }

    [Fact]
    public void The_runner_never_chooses_a_solver_without_a_plan()
    {
        // ortools found nothing: its (empty) plan leaves every stop out, yet its objective 0 is the lowest.
        var empty = Judge(Small);
        var plan = Judge(Small, [0, 1, 2]);
        var judged = new[]
        {
            new JudgedResult(new SolverResult("ortools", Plan.Empty, 1, 0, [], SolverStatus.NoSolution) { HasPlan = false }, empty),
            new JudgedResult(new SolverResult("sa", new Plan([new PlannedRoute(0, [0, 1, 2])]), 1, 0, [], SolverStatus.Completed), plan),
        };
        Assert.True(empty.Objective <= plan.Objective);
        Assert.Equal(1, RunCoordinator.Choose(judged));
    }

    /// <summary>A feasible one-route evaluation with the given distance, duration and objective.</summary>
    private static PlanEvaluation Made(double distance, double duration, double objective = 0)
    {
        var metrics = new RouteMetrics { StopCount = 1, Distance = distance, Duration = duration };
        var route = new RouteEvaluation(0, [0], metrics, new VisitTimes[1], [[0.0]], objective, true);
        return new PlanEvaluation([route], [], new CostBreakdown { Fixed = objective }, []);
    }
}
