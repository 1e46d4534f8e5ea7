using Anneal.Formats.Input;
using Anneal.Jobs;

namespace Anneal.Tests.Jobs;

/// <summary>
/// What the runner gives the solvers and says about it: on 10,000 stops `ortools` is left out of the defaults with
/// a note, named it runs after saying its expected memory, and a whole run's budget keeps room for writing the
/// files; benchmark runs keep their whole budget. Oversubscription is named.
/// </summary>
public sealed class RunBudgetTests
{
    [SkippableFact]
    public void Above_5000_stops_ortools_is_left_out_of_the_defaults_and_named_it_says_its_memory()
    {
        var large = InputLoader.Load(BenchmarkData.File("generated/planar-10000.txt"));
        var plan = Hosting.Runner.Prepare(large, new JobRequest());
        Assert.DoesNotContain("ortools", plan.SolverNames);
        Assert.Contains(plan.Notes, n => n.StartsWith("ortools is left out of the default solvers above 5,000 stops", StringComparison.Ordinal));

        var named = Hosting.Runner.Prepare(large, new JobRequest { Solvers = "ortools" });
        Assert.Equal(["ortools"], named.SolverNames);
        Assert.Contains(named.Notes, n => n.StartsWith("ortools: expected peak memory", StringComparison.Ordinal));

        var smaller = InputLoader.Load(BenchmarkData.File("homberger/r1_10_1.txt"));
        Assert.Contains("ortools", Hosting.Runner.Prepare(smaller, new JobRequest()).SolverNames);
    }

    [SkippableFact]
    public void A_whole_run_keeps_time_for_its_files_and_a_benchmark_run_does_not()
    {
        var large = InputLoader.Load(BenchmarkData.File("generated/planar-10000.txt"));
        var whole = Hosting.Runner.Prepare(large, new JobRequest { Solvers = "sa", TimeSeconds = 10, WholeRun = true, Spent = TimeSpan.FromSeconds(0.5) });
        Assert.Equal(10, whole.Seconds);
        Assert.True(whole.Options.TimeLimit < TimeSpan.FromSeconds(10));
        Assert.True(whole.Options.TimeLimit > TimeSpan.FromSeconds(5));
        Assert.Contains(whole.Notes, n => n.StartsWith("the solvers had", StringComparison.Ordinal));

        var bench = Hosting.Runner.Prepare(large, new JobRequest { Solvers = "sa", TimeSeconds = 10 });
        Assert.Equal(TimeSpan.FromSeconds(10), bench.Options.TimeLimit);

        // The 5% tolerance of a long budget covers writing even this job: nothing is kept back.
        var longRun = Hosting.Runner.Prepare(large, new JobRequest { Solvers = "sa", TimeSeconds = 600, WholeRun = true });
        Assert.Equal(TimeSpan.FromSeconds(600), longRun.Options.TimeLimit);
    }

    [Theory]
    [InlineData(3, 1, 1, 2, true)]
    [InlineData(2, 1, 1, 2, false)]
    [InlineData(1, 64, 1, 2, true)]
    [InlineData(1, 1, 2, 2, false)]
    [InlineData(2, 1, 2, 2, true)]
    public void Oversubscription_is_named_when_searches_outnumber_cores(int solvers, int threads, int jobs, int cores, bool warned)
    {
        var warning = Oversubscription.Warning(solvers, threads, jobs, cores);
        Assert.Equal(warned, warning is not null);
        if (warning is not null)
        {
            Assert.Contains($"{solvers * threads * jobs:N0} searches on {cores} core(s)", warning, StringComparison.Ordinal);
        }
    }
}
