using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Core.Solving;
using Anneal.OrTools;
using Anneal.Search.Construction;

namespace Anneal.Tests.Core.Solving;

/// <summary>
/// Deadline-only runs (no iteration limit) end and hand back a result: OR-Tools from its warm start, and the run as
/// a whole when one solver ignores its budget. The time bounds are generous ceilings; quality is not checked.
/// </summary>
public sealed class RunDeadlineTests
{
    [SkippableFact]
    public void A_deadline_only_routing_run_returns_its_plan()
    {
        var instance = Anneal.Formats.Input.InputLoader.Load(BenchmarkData.File("solomon/r101.txt")).Instance;
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var result = new OrToolsSolver(start: new InsertionStart()).Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(1) }, null, default);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(60), $"took {clock.Elapsed}");
        Assert.True(result.HasPlan);
        Assert.NotEmpty(result.Plan.Routes);
        Assert.Equal(SolverStatus.TimeLimit, result.Status);
    }

    [Fact]
    public void A_solver_that_ignores_its_budget_is_left_and_the_run_goes_on_with_the_others()
    {
        var instance = TinyInstances.Random(5, 8, 2);
        var solvers = new ISolver[] { new InsertionSolver(), new Sleeper() };
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var outcome = RunCoordinator.Run(instance, solvers, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(0.2) }, null, default);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(30), $"took {clock.Elapsed}");
        Assert.Equal(0, outcome.Chosen);
        var left = outcome.Results[1].Result;
        Assert.False(left.HasPlan);
        Assert.Equal(SolverStatus.Overran, left.Status);
        Assert.Contains(left.Notes ?? [], n => n.StartsWith("did not stop within 2 s of its budget", StringComparison.Ordinal) && n.EndsWith("it had offered no plan", StringComparison.Ordinal));
    }

    [Fact]
    public void A_solver_left_behind_is_reported_with_the_best_plan_it_had_offered()
    {
        var instance = TinyInstances.Random(5, 8, 2);
        var offered = new InsertionSolver().Solve(instance, new SolveOptions(), null, default).Plan;
        var outcome = RunCoordinator.Run(instance, [new Sleeper(offered)], new SolveOptions { TimeLimit = TimeSpan.FromSeconds(0.2) }, null, default);
        var left = outcome.Results[0].Result;
        Assert.Equal(SolverStatus.Overran, left.Status);
        Assert.True(left.HasPlan);
        Assert.Same(offered, left.Plan);
        Assert.Equal(0, outcome.Chosen);
        Assert.Contains(left.Notes ?? [], n => n.EndsWith("with the best plan it had offered by then", StringComparison.Ordinal));
    }

    [Fact]
    public void Copies_of_a_seeded_search_left_behind_are_not_waited_for_and_their_offers_stand_in()
    {
        var instance = TinyInstances.Random(5, 8, 2);
        var result = new HalfSleeping().Solve(instance, new SolveOptions { TimeLimit = TimeSpan.FromSeconds(0.2), Threads = 2 }, null, default);
        Assert.True(result.HasPlan);
        Assert.Equal(SolverStatus.TimeLimit, result.Status);
        Assert.Contains(result.Notes ?? [], n => n.StartsWith("1 of the 2 copies did not return within 1 s of the budget", StringComparison.Ordinal));
    }

    [Fact]
    public void The_local_searches_offer_their_plan_as_they_go()
    {
        var instance = TinyInstances.Random(5, 8, 2);
        var incumbent = new Incumbent();
        new Anneal.Search.Annealing.SimulatedAnnealing().Solve(instance, new SolveOptions { IterationLimit = 200, Incumbent = incumbent }, null, default);
        Assert.NotNull(incumbent.Plan);
        Assert.NotEmpty(incumbent.Plan!.Routes);
    }

    /// <summary>Copy 0 offers its construction and returns an empty plan; copy 1 offers it too and blocks.</summary>
    private sealed class HalfSleeping : Anneal.Search.Running.SeededSearch
    {
        public override string Name => "half-sleeping";

        public override string? Declines(Instance instance) => null;

        protected override SolverResult SolveOnce(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
        {
            var plan = new InsertionSolver().Solve(instance, new SolveOptions(), null, default).Plan;
            options.Incumbent!.Offer(plan, true, 1);
            if (options.Seed != 1)
            {
                Thread.Sleep(TimeSpan.FromMinutes(10));
            }

            return new SolverResult(Name, Plan.Empty, 0, 0, [], SolverStatus.NoSolution) { HasPlan = false };
        }
    }

    /// <summary>A solver that never looks at its clock or its token: blocks far past any budget, having offered <paramref name="offer"/>.</summary>
    private sealed class Sleeper(Plan? offer = null) : ISolver
    {
        public string Name => "sleeper";

        public string? Declines(Instance instance) => null;

        public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
        {
            if (offer is not null)
            {
                options.Incumbent!.Offer(offer, true, 1);
            }

            Thread.Sleep(TimeSpan.FromMinutes(10));
            return new SolverResult(Name, Plan.Empty, 600, 600, [], SolverStatus.Completed);
        }
    }
}
