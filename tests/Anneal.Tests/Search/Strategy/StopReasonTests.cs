using Anneal.Core.Solving;
using Anneal.Search.Annealing;
using Anneal.Search.Tabu;

namespace Anneal.Tests.Search.Strategy;

/// <summary>
/// The status says which limit stopped a search (issue 19: sa and tabu said "completed" when the clock had stopped
/// them, and with --iterations 20000 --time 10 both outcomes read the same). The README's status table is the vocabulary.
/// </summary>
public class StopReasonTests
{
    public static TheoryData<string> Solvers() => ["sa", "tabu"];

    [Theory]
    [MemberData(nameof(Solvers))]
    public void The_iteration_limit_reached_first_is_named(string solver)
    {
        var result = Solve(solver, new SolveOptions { Seed = 3, IterationLimit = 300, TimeLimit = TimeSpan.FromMinutes(5) }, default);

        Assert.Equal(SolverStatus.IterationLimit, result.Status);
        Assert.Equal("iteration limit", result.Status.ToText());
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void The_clock_reached_first_is_named(string solver)
    {
        // A billion iterations cannot run in 0.2 s on any machine, so the clock is what stops the search.
        var result = Solve(solver, new SolveOptions { Seed = 3, IterationLimit = 1_000_000_000, TimeLimit = TimeSpan.FromSeconds(0.2) }, default);

        Assert.Equal(SolverStatus.TimeLimit, result.Status);
        Assert.Equal("time limit", result.Status.ToText());
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void A_stop_request_is_named_interrupted(string solver)
    {
        using var stop = new CancellationTokenSource();
        stop.Cancel();

        var result = Solve(solver, new SolveOptions { Seed = 3, TimeLimit = TimeSpan.FromMinutes(5) }, stop.Token);

        Assert.Equal(SolverStatus.Interrupted, result.Status);
        Assert.True(result.HasPlan);
    }

    private static SolverResult Solve(string solver, SolveOptions options, CancellationToken stop)
    {
        // Distance only: no fleet phase, so the iteration budget is all plain moves and the test stays quick.
        var instance = RandomInstances.Create(new Random(11), 25, 4, hardWindows: true).With(objective: Anneal.Core.Model.Objective.Distance);
        ISolver search = solver == "sa" ? new SimulatedAnnealing() : new TabuSearch();
        return search.Solve(instance, options, null, stop);
    }
}
