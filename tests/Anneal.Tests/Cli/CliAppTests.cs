using Anneal.Cli;
using Anneal.Formats.Input;

namespace Anneal.Tests.Cli;

public sealed class CliAppTests : CommandTest
{
    private int Run(params string[] args) => CliApp.Run(args, Out, Err);

    [Fact]
    public void Check_on_a_missing_path_exits_2_and_names_it()
    {
        string missing = Path.Combine(Dir, "no-such-job");

        Assert.Equal(ExitCodes.InvalidInput, Run("check", missing));
        Assert.Contains(missing, All, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", All, StringComparison.Ordinal);
    }

    [Fact]
    public void Solve_on_a_missing_path_exits_2_without_a_stack_trace()
    {
        string missing = Path.Combine(Dir, "nothing.txt");

        Assert.Equal(ExitCodes.InvalidInput, Run("solve", missing, "--out", Path.Combine(Dir, "out")));
        Assert.Contains(missing, Err.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", All, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("solve", "x", "--objective", "fastest")]
    [InlineData("solve", "x", "--no-such-option")]
    [InlineData("evaluate", "x")]
    [InlineData("frobnicate")]
    [InlineData]
    public void UsageErrors_exit_2(params string[] args)
    {
        Assert.Equal(ExitCodes.InvalidInput, Run(args));
        Assert.Contains("--help", Err.ToString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--help")]
    [InlineData("check", "--help")]
    [InlineData("evaluate", "--help")]
    [InlineData("solve", "--help")]
    public void Every_command_has_help(params string[] args)
    {
        Assert.Equal(ExitCodes.Success, Run(args));
        Assert.Contains("Usage:", Out.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Version_prints_a_version_number()
    {
        Assert.Equal(ExitCodes.Success, Run("--version"));
        Assert.Matches(@"^\d+\.\d+\.\d+", Out.ToString());
    }

    [Fact]
    public void Bad_time_budget_exits_2_before_reading_anything()
    {
        Assert.Equal(ExitCodes.InvalidInput, Run("solve", "x", "--time", "0"));
        Assert.Contains("--time", Err.ToString(), StringComparison.Ordinal);
    }

    [SkippableFact]
    public void Solve_on_a_small_Solomon_file_writes_the_threeOutputs()
    {
        // Five customers in Solomon's layout (Solomon 1987; the column order of the published files); wide windows,
        // small demands, so any sensible plan is feasible.
        const string text = """
            TINY5

            VEHICLE
            NUMBER     CAPACITY
              3         100

            CUSTOMER
            CUST NO.  XCOORD.   YCOORD.    DEMAND   READY TIME  DUE DATE   SERVICE   TIME

                0      40         50          0          0       1000          0
                1      45         68         10          0        900         10
                2      45         70         20          0        900         10
                3      42         66         10          0        900         10
                4      30         50         10          0        900         10
                5      35         35         20          0        900         10
            """;
        Assert.True(SolomonReader.LooksLike(text), "the sample must read as a Solomon file");
        string file = Path.Combine(Dir, "tiny5.txt");
        File.WriteAllText(file, text);
        string outDir = Path.Combine(Dir, "run");

        Assert.Equal(ExitCodes.Success, Run("check", file));
        int code = Run("solve", file, "--solvers", "insertion", "--time", "1", "--out", outDir, "--quiet");

        Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, All);
        Assert.True(File.Exists(Path.Combine(outDir, "routes.csv")));
        Assert.True(File.Exists(Path.Combine(outDir, "summary.json")));
        Assert.True(File.Exists(Path.Combine(outDir, "trace.csv")));
    }
}
