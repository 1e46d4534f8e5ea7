using System.Text.Json;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Formats.Input.Csv;
using Anneal.Formats.Input.Json;
using Anneal.Tests.Fixtures;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>docs/settings.sample.json holds every settings key, loads as a job's settings.json, and the README's table names every key.</summary>
public class SettingsSampleTests
{
    private static string Sample => Path.Combine(BenchmarkData.RepoRoot, "docs", "settings.sample.json");

    [Fact]
    public void The_sample_loads_and_every_value_in_it_takes_effect()
    {
        var files = JobFolder.ValidPlanar();
        files["settings.json"] = File.ReadAllText(Sample);
        using var job = new JobFolder(files);

        var loaded = CsvJobReader.Read(job.Path);

        Assert.Equal(Objective.Cost, loaded.Instance.Objective);
        Assert.Equal(60, loaded.Settings.TimeSeconds);
        Assert.Equal(["sa", "tabu", "ortools"], loaded.Settings.Solvers!);
        Assert.Equal(1, loaded.Settings.Seed);
        var rules = loaded.Instance.Rules;
        Assert.Equal(Rule.Soft(2), rules.TimeWindows);
        Assert.Equal(Rule.Soft(1.5), rules.ShiftEnd);
        Assert.True(rules.Capacity.Hard && rules.MaxDuration.Hard && rules.Unserved.Hard);
        Assert.Equal(250, rules.Unserved.Price);
        Assert.All(loaded.Instance.Vehicles, v => Assert.Same(Anneal.Core.DrivingRules.DrivingPresets.Eu, v.DrivingRules));
        Assert.Equal("plan.csv", loaded.Settings.Replan!.From);
        Assert.Equal(11 * 60 + 20, loaded.Settings.Replan.Now);
        Assert.Equal(["van-3"], loaded.Settings.Replan.Without);
    }

    [Fact]
    public void The_sample_and_the_readme_name_every_key_the_reader_accepts()
    {
        var written = new List<string>();
        Leaves(JsonTree.Parse(File.ReadAllBytes(Sample)), string.Empty, written);
        string readme = File.ReadAllText(Path.Combine(BenchmarkData.RepoRoot, "README.md"));

        Assert.Equal(SettingsKeys.Paths().Order(), written.Order());
        foreach (var key in SettingsKeys.Paths())
        {
            Assert.Contains($"`{key}`", readme, StringComparison.Ordinal);
        }
    }

    private static void Leaves(JsonTree node, string path, List<string> into)
    {
        foreach (var (key, _, _, value) in node.Members)
        {
            if (value.Kind == JsonTokenType.StartObject)
            {
                // A driving-rule set's name is the user's: the reader's list writes it as <name>.
                string name = path == "drivingRules.sets." ? SettingsKeys.SetName : key;
                Leaves(value, path + name + ".", into);
            }
            else
            {
                into.Add(path + key);
            }
        }
    }
}
