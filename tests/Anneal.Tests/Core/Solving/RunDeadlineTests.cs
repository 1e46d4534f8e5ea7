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
        Assert.Equal(SolverStatus.TimeLimit, left.Status);
        Assert.Contains(left.Notes ?? [], n => n.StartsWith("did not stop within 2 s of its budget", StringComparison.Ordinal));
    }

    /// <summary>A solver that never looks at its clock or its token: blocks far past any budget.</summary>
    private sealed class Sleeper : ISolver
    {
        public string Name => "sleeper";

        public string? Declines(Instance instance) => null;

        public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
        {
            Thread.Sleep(TimeSpan.FromMinutes(10));
            return new SolverResult(Name, Plan.Empty, 600, 600, [], SolverStatus.Completed);
        }
    }
}
