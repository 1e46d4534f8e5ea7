using Anneal.Core.DrivingRules;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Formats.Input.Csv;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>vehicles.csv's driving_rules column and settings.json's drivingRules: presets, a default, sets of one's own, and located errors.</summary>
public class DrivingRulesInputTests
{
    private static Dictionary<string, string> Job(string vehicles, string settings)
    {
        var files = JobFolder.ValidPlanar();
        files["vehicles.csv"] = vehicles;
        files["settings.json"] = settings;
        return files;
    }

    [Fact]
    public void Vehicles_name_a_preset_a_set_of_their_own_or_none_and_the_rest_take_the_default()
    {
        var files = Job(
            "id,capacity_kg,capacity_m3,equipment,driving_rules\neu,100,8,cold,eu-561\nus,100,8,,US-HOS-PROPERTY\nown,100,8,,late-eu\nfree,100,8,,none\nplain,100,8,,\n",
            "{ \"drivingRules\": { \"default\": \"eu-561\", \"sets\": { \"late-eu\": { \"basedOn\": \"eu-561\", \"drivingBeforeBreakMinutes\": 240, \"hard\": false, \"pricePerMinute\": 3 } } } }");
        using var job = new JobFolder(files);

        var v = CsvJobReader.Read(job.Path).Instance.Vehicles;

        Assert.Same(DrivingPresets.Eu, v[0].DrivingRules);
        Assert.Same(DrivingPresets.Us, v[1].DrivingRules);
        var own = v[2].DrivingRules!;
        Assert.Equal(("late-eu", 240.0, 45.0, 540.0), (own.Name, own.DrivingBeforeBreak, own.BreakMinutes, own.DailyDriving));
        Assert.Equal(Rule.Soft(3), own.Rule);
        Assert.Null(v[3].DrivingRules);
        Assert.Same(DrivingPresets.Eu, v[4].DrivingRules);
    }

    [Fact]
    public void Without_a_column_or_a_default_no_vehicle_has_driving_rules()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());

        Assert.All(CsvJobReader.Read(job.Path).Instance.Vehicles, v => Assert.Null(v.DrivingRules));
    }

    [Fact]
    public void Unknown_names_and_bad_values_are_located_with_a_fix()
    {
        var files = Job(
            "id,capacity_kg,capacity_m3,driving_rules\nvan,100,8,eu-516\n",
            "{\n \"drivingRules\": {\n  \"default\": \"eu561\",\n  \"sets\": {\n   \"mine\": { \"breakMinutes\": -5 },\n   \"half\": { \"basedOn\": \"eu-561\", \"splitFirstMinutes\": 0 }\n  }\n }\n}");
        using var job = new JobFolder(files);

        var p = Assert.Throws<InputException>(() => CsvJobReader.Read(job.Path)).Problems;

        var column = Assert.Single(p, x => x is { File: "vehicles.csv", Row: 2, Column: "driving_rules", Value: "eu-516" });
        Assert.Contains("'eu-561'", column.Fix, StringComparison.Ordinal);
        Assert.Contains(p, x => x is { File: "settings.json", Row: 3, JsonPath: "drivingRules.default" } && x.Fix.Contains("'eu-561'", StringComparison.Ordinal));
        Assert.Contains(p, x => x is { File: "settings.json", Row: 5, JsonPath: "drivingRules.sets.mine.breakMinutes", Value: "-5" });
        Assert.Contains(p, x => x is { File: "settings.json", JsonPath: "drivingRules.sets.mine.dailyDrivingMinutes" });
        Assert.Contains(p, x => x is { File: "settings.json", JsonPath: "drivingRules.sets.half.splitFirstMinutes" });
    }
}
