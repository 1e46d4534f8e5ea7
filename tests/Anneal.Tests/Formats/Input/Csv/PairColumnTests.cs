using Anneal.Formats.Input;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>stops.csv's pickup_&lt;dim&gt; and collect_from columns: read into the model, and every mistake named with row, column and value.</summary>
public class PairColumnTests
{
    private static Dictionary<string, string> Job(string stops) => new()
    {
        ["stops.csv"] = "id,x,y,demand_kg,pickup_kg,collect_from,optional\n" + stops,
        ["depots.csv"] = "id,x,y\nhub,0,0\n",
        ["vehicles.csv"] = "id,count,depot,capacity_kg\nvan,2,hub,100\n",
    };

    private static IReadOnlyList<InputProblem> Problems(string stops)
    {
        using var job = new JobFolder(Job(stops));
        return Assert.Throws<InputException>(() => InputLoader.Load(job.Path)).Problems;
    }

    [Fact]
    public void Returns_and_a_pair_are_read()
    {
        using var job = new JobFolder(Job("a,1,0,10,4,,\nmill,2,0,0,7,,\nshop,3,0,7,0,mill,\n"));

        var inst = InputLoader.Load(job.Path).Instance;

        Assert.Equal(4, inst.Pickup(0, 0));
        Assert.Equal(1, inst.Stops[2].CollectFrom);
        Assert.Equal(0, inst.DepotLoad(2, 0));
        Assert.True(inst.HasPairs);
    }

    [Theory]
    [InlineData("a,1,0,5,0,,\nb,2,0,5,0,zz,\n", 3, "no stop has id 'zz'")]
    [InlineData("a,1,0,5,0,a,\n", 2, "cannot collect from itself")]
    [InlineData("p,1,0,0,5,,\nd1,2,0,5,0,p,\nd2,3,0,5,0,p,\n", 4, "already collects from p")]
    [InlineData("p,1,0,0,5,,\nq,2,0,5,5,p,\nd,3,0,5,0,q,\n", 4, "is itself the delivery of a pair")]
    [InlineData("p,1,0,0,4,,\nd,2,0,5,0,p,\n", 3, "delivers 5 kg (demand_kg), but p collects 4 (pickup_kg)")]
    [InlineData("p,1,0,0,5,,yes\nd,2,0,5,0,p,no\n", 3, "is optional and the other is not")]
    public void A_mistake_in_collect_from_is_named(string stops, int row, string problem)
    {
        var p = Assert.Single(Problems(stops));

        Assert.Equal(row, p.Row);
        Assert.Equal("collect_from", p.Column);
        Assert.Contains(problem, p.Problem, StringComparison.Ordinal);
        Assert.EndsWith("stops.csv", p.File, StringComparison.Ordinal);
    }

    [Fact]
    public void A_pickup_column_without_a_capacity_is_named()
    {
        using var job = new JobFolder(new Dictionary<string, string>(Job("a,1,0,5,0,,\n")) { ["stops.csv"] = "id,x,y,demand_kg,pickup_pallets\na,1,0,5,2\n" });

        var p = Assert.Single(Assert.Throws<InputException>(() => InputLoader.Load(job.Path)).Problems);

        Assert.Equal("pickup_pallets", p.Column);
        Assert.Contains("capacity_pallets", p.Fix, StringComparison.Ordinal);
    }
}
