using Anneal.Core.Model;
using Anneal.OrTools;
using Anneal.Core.Solving;

namespace Anneal.Tests.OrTools;

/// <summary>
/// The OR-Tools and CP-SAT adapters check their integer scaling before any native call and decline with a reason
/// (issue 19). Before the guard, a stop with two soft windows far from the depot ended the test host inside OR-Tools
/// ("Check failed: ClosedIntervalNoLargerThan(vmin, vmax, 0xFFFFFFFF) Bitset too large", seen here), and the issue
/// saw a shift end of 1e308 ("min_capacity >= 0 (-9223372036854775808 vs. 0)") and a service of 1e308 do the same;
/// a cost per km of 1e308 gave an "Infinity" objective. The guard is asserted first, so a regression fails here
/// instead of taking the test host down with it.
/// </summary>
public class ScalingGuardTests
{
    private static readonly SolveOptions Short = new() { TimeLimit = TimeSpan.FromSeconds(1), IterationLimit = 50 };

    public static TheoryData<string> Cases() => ["gapped windows far away", .. ExactCases()];

    // CP-SAT takes domains with holes of any size; only the routing model has the 2^32 limit.
    public static TheoryData<string> ExactCases() => ["service 1e308", "shift end 1e308", "cost per km 1e308", "capacity 1e300"];

    [Theory]
    [MemberData(nameof(Cases))]
    public void OrTools_declines_a_model_that_does_not_fit_its_integers_with_the_reason(string name)
    {
        var instance = Build(name);
        Assert.NotNull(ScalingGuard.Check(instance, new IntegerScale(instance)));

        var result = new OrToolsSolver().Solve(instance, Short, null, default);

        Assert.False(result.HasPlan);
        Assert.Equal(SolverStatus.Declined, result.Status);
        Assert.StartsWith("the model does not fit the solver's integers: ", Assert.Single(result.Notes!), StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(ExactCases))]
    public void Exact_declines_a_model_that_does_not_fit_its_integers(string name)
    {
        var instance = Build(name);

        var result = new ExactSolver().Solve(instance, Short, null, default);

        Assert.False(result.HasPlan);
        Assert.Equal(SolverStatus.Declined, result.Status);
        Assert.StartsWith("the model does not fit", Assert.Single(result.Notes!), StringComparison.Ordinal);
    }

    [Fact]
    public void Ordinary_instances_pass_the_guard()
    {
        for (int seed = 1; seed <= 20; seed++)
        {
            var instance = TinyInstances.Random(seed, 12, 3);
            Assert.Null(ScalingGuard.Check(instance, new IntegerScale(instance)));
        }
    }

    private static Instance Build(string name)
    {
        var near = TinyInstances.Stop("near", 10, open: 0, close: 100);
        var far = TinyInstances.Stop("far", 20);
        var vehicle = TinyInstances.Vehicle("v1", shiftEnd: 1000);
        var rules = RuleSet.AllHard;
        switch (name)
        {
            case "gapped windows far away":
                near = near with { Windows = [new TimeWindow(0, 100), new TimeWindow(200, 300)] };
                far = far with { X = 1e7 };
                rules = new RuleSet { TimeWindows = Rule.Soft(2) };
                break;
            case "service 1e308":
                far = far with { ServiceTime = 1e308 };
                break;
            case "shift end 1e308":
                vehicle = vehicle with { ShiftEnd = 1e308 };
                break;
            case "cost per km 1e308":
                vehicle = vehicle with { CostPerDistance = 1e308 };
                return TinyInstances.Line([near, far], [vehicle], rules, Objective.Cost);
            case "capacity 1e300":
                vehicle = vehicle with { Capacity = [1e300] };
                break;
        }

        return TinyInstances.Line([near, far], [vehicle], rules);
    }
}
