using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using CsCheck;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

/// <summary>
/// Damaged files either read into something the evaluator accepts or fail with located InputProblems;
/// never any other exception.
/// </summary>
public class ReaderFuzzTests
{
    private const int Iterations = 300;

    // Fixed first seeds keep the runs deterministic; set CsCheck_Seed or change these to explore further.
    private const string SolomonSeed = "d7zz9J9Ua6Y1";
    private const string CvrplibSeed = "0N0XIzNsQ0O2";
    private const string RouteSeed = "4a3dFhhvcWPm";

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Damaged_solomon_text_reads_or_fails_cleanly() => InstanceProperty(SampleTexts.Solomon, "fuzz.txt", SolomonSeed, SolomonReader.Parse);

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Damaged_cvrplib_text_reads_or_fails_cleanly() => InstanceProperty(SampleTexts.Cvrplib, "fuzz.vrp", CvrplibSeed, CvrplibReader.Parse);

    private static void InstanceProperty(string sample, string file, string seed, Func<string, string, Instance> parse) =>
        TextMutation.Several.Sample(m =>
        {
            string text = TextMutation.Apply(sample, m);
            ReadOrFail(text, file, () => CheckInstance(parse(text, file)));
        }, seed: seed, iter: FuzzBudget.Cases(Iterations), threads: 1);

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Damaged_route_files_read_or_fail_with_a_row()
    {
        var instance = SolomonReader.Parse(SampleTexts.Solomon, "tiny.txt");
        TextMutation.Several.Sample(m =>
        {
            string text = TextMutation.Apply(SampleTexts.SolomonRoutes, m);
            ReadOrFail(text, "fuzz.sol", () =>
            {
                var plan = RouteFileReader.Parse(text, "fuzz.sol", instance);
                Assert.Empty(plan.StructureErrors(instance));
                Assert.True(double.IsFinite(PlanEvaluator.Evaluate(instance, plan).Objective));
            }, rowRequired: true);
        }, seed: RouteSeed, iter: FuzzBudget.Cases(Iterations), threads: 1);
    }

    private static void ReadOrFail(string text, string file, Action read, bool rowRequired = false)
    {
        try
        {
            read();
        }
        catch (InputException e)
        {
            int lines = text.Split('\n').Length + text.Split('\r').Length;
            Assert.NotEmpty(e.Problems);
            foreach (var p in e.Problems)
            {
                Assert.Equal(file, p.File);
                Assert.False(string.IsNullOrWhiteSpace(p.Problem));
                Assert.False(string.IsNullOrWhiteSpace(p.Fix));

                // A problem points at a line, or else at the field or section that is missing or wrong.
                Assert.True(p.Row is not null || (!rowRequired && p.Column is not null), $"problem without a location: {p}");
                Assert.True(p.Row is null || (p.Row >= 1 && p.Row <= lines), $"row out of the file: {p}");
            }
        }
    }

    /// <summary>What a reader returns must be usable: finite data, and the evaluator can cost a route through it.</summary>
    private static void CheckInstance(Instance inst)
    {
        Assert.NotEmpty(inst.Vehicles);
        Assert.Single(inst.Depots);
        foreach (var s in inst.Stops)
        {
            Assert.True(s.Demand[0] >= 0 && double.IsFinite(s.Demand[0]));
            Assert.True(s.ServiceTime >= 0 && double.IsFinite(s.ServiceTime));
            Assert.True(double.IsFinite(s.X) && double.IsFinite(s.Y));
            Assert.True(s.Windows[0].Open <= s.Windows[0].Close);
        }

        var all = new int[inst.StopCount];
        for (int i = 0; i < all.Length; i++)
        {
            all[i] = i;
        }

        var result = PlanEvaluator.Evaluate(inst, new Plan([new PlannedRoute(0, all)]));
        Assert.True(double.IsFinite(result.Objective));
        Assert.Empty(result.Unserved);
    }
}
