using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Reports;
using Anneal.Formats.Output.Runs;

namespace Anneal.Tests.Reports;

public sealed class PlotCommandTests : CommandTest
{
    [Fact]
    public void Plot_redraws_the_same_files_from_a_saved_run()
    {
        string folder = SavedRun.Solve(Dir);
        var before = RunReport.Files.ToDictionary(f => f, f => File.ReadAllBytes(Path.Combine(folder, f)));
        foreach (var f in RunReport.Files)
        {
            File.Delete(Path.Combine(folder, f));
        }

        int code = PlotCommand.Execute(folder, null, new CliContext(Out, Err));

        Assert.Equal(ExitCodes.Success, code);
        foreach (var (file, bytes) in before)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(folder, file))), file + " differs after the redraw");
        }
    }

    [Fact]
    public void When_the_input_has_moved_only_the_convergence_plot_is_redrawn_and_the_message_says_how_to_fix_it()
    {
        string folder = SavedRun.Solve(Dir);
        string recordPath = Path.Combine(folder, RunRecordFile.FileName);
        var record = RunRecordFile.Read(recordPath);
        RunRecordFile.Write(recordPath, record with { InputPath = Path.Combine(Dir, "gone") });
        File.Delete(Path.Combine(folder, "convergence.png"));

        int code = PlotCommand.Execute(folder, null, new CliContext(Out, Err));

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.True(File.Exists(Path.Combine(folder, "convergence.png")));
        Assert.Contains("--input", Err.ToString(), StringComparison.Ordinal);
        Assert.Equal(ExitCodes.Success, PlotCommand.Execute(folder, ReportFixtures.HarbourSmall, new CliContext(Out, Err)));
    }

    [Fact]
    public void A_folder_without_run_json_is_refused_with_exit_2()
    {
        Assert.Equal(ExitCodes.InvalidInput, PlotCommand.Execute(Dir, null, new CliContext(Out, Err)));
        Assert.Contains("run.json", Err.ToString(), StringComparison.Ordinal);
    }
}
