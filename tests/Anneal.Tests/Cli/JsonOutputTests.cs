using System.Text.Json;
using System.Text.Json.Nodes;
using Anneal.Cli;
using Anneal.Formats.Output;
using Anneal.Tests.Fixtures;
using Anneal.Tests.Formats.Input.Csv;

namespace Anneal.Tests.Cli;

/// <summary>`--json`: one document on stdout, read back by System.Text.Json; for solve and evaluate the same fields as summary.json.</summary>
public sealed class JsonOutputTests : CommandTest
{
    private static readonly string[] Envelope = ["exitCode", "error", "problems"];

    [Fact]
    public void Solve_json_prints_summary_json_with_the_exit_code_and_folder_and_nothing_else()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());
        string run = Path.Combine(Dir, "run");

        int code = CliApp.Run(["solve", job.Path, "--solvers", "insertion", "--time", "2", "--out", run, "--json"], Out, Err);

        var printed = Single(Out.ToString());
        Assert.Equal(code, printed["exitCode"]!.GetValue<int>());
        Assert.Null(printed["error"]);
        Assert.Empty(printed["problems"]!.AsArray());
        Assert.Equal(run, printed["folder"]!.GetValue<string>());
        Assert.Contains("Chosen: insertion", Err.ToString(), StringComparison.Ordinal); // the usual text, on stderr

        var written = JsonNode.Parse(File.ReadAllText(Path.Combine(run, SummaryJsonWriter.FileName)))!.AsObject();
        foreach (var (key, value) in written)
        {
            Assert.True(JsonNode.DeepEquals(value, printed[key]), $"'{key}' differs from summary.json");
        }

        Assert.Equal(written.Count + Envelope.Length + 1, printed.Count);
    }

    [Fact]
    public void Evaluate_json_prints_the_summary_without_writing_a_folder()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());
        string routes = Path.Combine(Dir, "plan.txt");
        File.WriteAllText(routes, "Route #1: s1 s2\nRoute #2: s3\n");

        int code = CliApp.Run(["evaluate", job.Path, "--routes", routes, "--json"], Out, Err);

        var printed = Single(Out.ToString());
        Assert.Equal(code, printed["exitCode"]!.GetValue<int>());
        Assert.Null(printed["folder"]);
        Assert.Empty(printed["plan"]!["unserved"]!.AsArray());
        Assert.Equal(2, printed["plan"]!["vehicles"]!.GetValue<int>());
        Assert.Equal(ToolVersion.Version, printed["annealVersion"]!.GetValue<string>());
    }

    [Fact]
    public void Check_json_lists_each_problem_with_file_row_column_value_and_fix_and_the_exit_code()
    {
        var files = JobFolder.ValidPlanar();
        files["stops.csv"] = files["stops.csv"].Replace("s2,6,8,20,", "s2,6,8,lots,", StringComparison.Ordinal);
        using var job = new JobFolder(files);

        int code = CliApp.Run(["check", job.Path, "--json"], Out, Err);

        Assert.Equal(ExitCodes.InvalidInput, code);
        var printed = Single(Out.ToString());
        Assert.Equal(ExitCodes.InvalidInput, printed["exitCode"]!.GetValue<int>());
        Assert.False(printed["valid"]!.GetValue<bool>());
        var problem = printed["problems"]!.AsArray().Single()!;
        Assert.Equal(("stops.csv", 3, "demand_kg", "lots"),
            (problem["file"]!.GetValue<string>(), problem["row"]!.GetValue<int>(), problem["column"]!.GetValue<string>(), problem["value"]!.GetValue<string>()));
        Assert.False(string.IsNullOrWhiteSpace(problem["fix"]!.GetValue<string>()));
        Assert.Contains("lots", Err.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Check_json_of_a_valid_input_says_what_it_read()
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());

        Assert.Equal(ExitCodes.Success, CliApp.Run(["check", job.Path, "--json"], Out, Err));

        var printed = Single(Out.ToString());
        Assert.Equal((0, true, "csv-job", 3), (printed["exitCode"]!.GetValue<int>(), printed["valid"]!.GetValue<bool>(), printed["format"]!.GetValue<string>(), printed["stops"]!.GetValue<int>()));
    }

    [Theory]
    [InlineData("--time", "abc")]
    [InlineData("--tim", "2")]
    public void A_wrong_option_with_json_is_a_document_too(string option, string value)
    {
        using var job = new JobFolder(JobFolder.ValidPlanar());

        int code = CliApp.Run(["solve", job.Path, option, value, "--json"], Out, Err);

        Assert.Equal(ExitCodes.InvalidInput, code);
        var printed = Single(Out.ToString());
        Assert.Equal(ExitCodes.InvalidInput, printed["exitCode"]!.GetValue<int>());
        Assert.StartsWith("the command line is not valid", printed["error"]!.GetValue<string>(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_input_with_json_names_it_in_the_document()
    {
        int code = CliApp.Run(["solve", Path.Combine(Dir, "nowhere"), "--json"], Out, Err);

        Assert.Equal(ExitCodes.InvalidInput, code);
        var problem = Single(Out.ToString())["problems"]!.AsArray().Single()!;
        Assert.Contains("nowhere", problem["file"]!.GetValue<string>(), StringComparison.Ordinal);
    }

    /// <summary>Stdout holds exactly one JSON document.</summary>
    private static JsonObject Single(string stdout)
    {
        var reader = new Utf8JsonReader(System.Text.Encoding.UTF8.GetBytes(stdout));
        var document = JsonNode.Parse(ref reader)!.AsObject();
        Assert.False(reader.Read(), "stdout holds more than one JSON document");
        return document;
    }
}
