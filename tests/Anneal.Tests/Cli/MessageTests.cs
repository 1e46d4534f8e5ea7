using System.CommandLine;
using System.CommandLine.Help;
using System.Text.RegularExpressions;
using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Tests.Fixtures;

namespace Anneal.Tests.Cli;

/// <summary>Every message speaks the user's language: no .NET type names, allowed values listed, all mistakes at once.</summary>
public sealed partial class MessageTests : CommandTest
{
    private int Run(params string[] args) => CliApp.Run(args, Out, Err);

    // What the runtime would print: System.Nullable`1[System.Double], System.Int32, Anneal.Worker.ShutdownChoice, reader text.
    [GeneratedRegex(@"System\.|`1|Int32|Int64|Boolean|Anneal\.(Core|Cli|Formats|Search|Jobs|Worker|Experiments|Reports|OrTools|Bounds)\.[A-Z]|LineNumber|BytePosition|Exception")]
    private static partial Regex DotNet();

    public static TheoryData<string, string> EveryOption()
    {
        var data = new TheoryData<string, string>();
        var root = CliApp.BuildRoot(new CliContext(TextWriter.Null, TextWriter.Null));
        foreach (var command in root.Subcommands)
        {
            foreach (var option in command.Options)
            {
                if (option is not HelpOption)
                {
                    data.Add(command.Name, option.Name);
                }
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(EveryOption))]
    public void A_wrong_value_for_any_option_gets_a_plain_message(string command, string option)
    {
        var args = new List<string> { command };
        if (command is not "worker")
        {
            args.Add(Path.Combine(Dir, "no-such-input"));
        }

        args.AddRange([option, "~wrong~"]);
        int code = Run([.. args]);

        Assert.NotEqual(ExitCodes.Success, code);
        Assert.DoesNotMatch(DotNet(), All);
        Assert.DoesNotContain("   at ", All, StringComparison.Ordinal);
        Assert.False(Directory.Exists("~wrong~"), "a wrong value must not become a folder");
    }

    [Fact]
    public void Every_wrong_option_is_reported_at_once_with_what_it_takes()
    {
        Assert.Equal(ExitCodes.InvalidInput, Run("solve", "x", "--time", "abc", "--threads", "0", "--seed", "one", "--objective", "distnace", "--iterations", "-5"));

        string err = Err.ToString();
        Assert.Contains("--time expects a number of seconds above 0, e.g. 30, not 'abc'", err, StringComparison.Ordinal);
        Assert.Contains("--threads expects a whole number, 1 or more", err, StringComparison.Ordinal);
        Assert.Contains("--seed expects a whole number", err, StringComparison.Ordinal);
        Assert.Contains("--objective expects cost, distance or vehicles-then-distance, not 'distnace'; did you mean distance?", err, StringComparison.Ordinal);
        Assert.Contains("--iterations expects a whole number, 1 or more", err, StringComparison.Ordinal);
        Assert.Contains("Try 'anneal solve --help'.", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new[] { "solve", "x", "--tim", "5" }, "unknown option '--tim' for anneal solve; did you mean --time?")]
    [InlineData(new[] { "bench", "x", "--seed", "3" }, "unknown option '--seed' for anneal bench; did you mean --seeds?")]
    [InlineData(new[] { "slove", "x" }, "unknown command 'slove'; did you mean solve?")]
    [InlineData(new[] { "evaluate", "x", "--route", "r.txt" }, "did you mean --routes?")]
    public void A_mistyped_name_suggests_the_nearest(string[] args, string expected)
    {
        Assert.Equal(ExitCodes.InvalidInput, Run(args));
        Assert.Contains(expected, Err.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("'5'", Err.ToString(), StringComparison.Ordinal); // the mistyped option's value is not a second complaint
        Assert.DoesNotContain("Required command", Err.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Worker_settings_of_the_wrong_kind_list_the_allowed_values_all_at_once()
    {
        var settings = new Dictionary<string, string?>
        {
            ["Worker:Outbox"] = Path.Combine(Dir, "out"),
            ["Worker:ConcurrentJobs"] = "two",
            ["Worker:OnShutdown"] = "Finish",
            ["Worker:Inbx"] = "in",
            ["Worker:MaxRetries"] = "-1",
            ["Worker:TimeSeconds"] = "1,5",
        };

        Assert.Equal(ExitCodes.InvalidInput, WorkerCommand.Execute(settings, once: true, new CliContext(Out, Err)));

        string err = Err.ToString();
        Assert.Contains("Worker:ConcurrentJobs (--jobs) must be a whole number, e.g. 2, not 'two'", err, StringComparison.Ordinal);
        Assert.Contains("Worker:OnShutdown must be Requeue or Complete, not 'Finish'", err, StringComparison.Ordinal);
        Assert.Contains("Worker:Inbx is not a worker setting; did you mean Inbox?", err, StringComparison.Ordinal);
        Assert.Contains("Worker:MaxRetries must be at least 0", err, StringComparison.Ordinal);
        Assert.Contains("Worker:TimeSeconds (--time) must be a number of seconds with a dot for decimals", err, StringComparison.Ordinal);
        Assert.Contains("the inbox folder is not set", err, StringComparison.Ordinal);
        Assert.DoesNotMatch(DotNet(), err);
        Assert.False(Directory.Exists(Path.Combine(Dir, "out")));
    }

    [Fact]
    public void Every_worker_setting_is_bound_and_a_wrong_one_named()
    {
        // Each setting given a value that fits no kind: the hand binder must know every one (none may throw).
        var settings = typeof(Anneal.Worker.WorkerOptions).GetProperties().ToDictionary(p => "Worker:" + p.Name, p => (string?)"~wrong~");
        settings["Worker:Inbox"] = Dir;
        settings["Worker:Outbox"] = Path.Combine(Dir, "out");

        Assert.Equal(ExitCodes.InvalidInput, WorkerCommand.Execute(settings, once: true, new CliContext(Out, Err)));

        foreach (var property in typeof(Anneal.Worker.WorkerOptions).GetProperties().Where(p => p.PropertyType != typeof(string)))
        {
            Assert.Contains($"Worker:{property.Name}", Err.ToString(), StringComparison.Ordinal);
        }

        Assert.DoesNotMatch(DotNet(), All);
    }

    [Fact]
    public void A_missing_input_a_missing_routes_file_and_an_unwritable_output_folder_each_get_their_own_sentence()
    {
        Directory.CreateDirectory(Path.Combine(Dir, "harbour-small"));
        Assert.Equal(ExitCodes.InvalidInput, Run("check", Path.Combine(Dir, "harbour-smal")));
        Assert.Contains("there is no file or folder at this path. Fix: did you mean", Out.ToString(), StringComparison.Ordinal);

        string job = Path.Combine(BenchmarkData.RepoRoot, "instances", "harbour-small");
        Assert.Equal(ExitCodes.InvalidInput, Run("evaluate", job, "--routes", Path.Combine(Dir, "plan.txt")));
        Assert.Contains("the routes file cannot be read: there is no such file", Err.ToString(), StringComparison.Ordinal);

        File.WriteAllText(Path.Combine(Dir, "taken"), "a file where the folder would go");
        Assert.Equal(ExitCodes.OutputFailed, Run("solve", job, "--out", Path.Combine(Dir, "taken", "run"), "--time", "1", "--quiet"));
        Assert.Contains($"the folder {Path.Combine(Dir, "taken", "run")} cannot be created: {Path.Combine(Dir, "taken")} is a file, not a folder", Err.ToString(), StringComparison.Ordinal);
        Assert.DoesNotMatch(DotNet(), All);
        Assert.DoesNotContain("Could not find", All, StringComparison.Ordinal);
    }
}
