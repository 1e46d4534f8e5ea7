using Anneal.Cli.Reporting;
using Anneal.Core.Solving;

namespace Anneal.Tests.Cli;

public sealed class ProgressReporterTests
{
    [Fact]
    public void Without_a_terminal_each_solver_logs_at_most_once_per_two_seconds_of_its_time()
    {
        var writer = new StringWriter();
        var progress = new ProgressReporter(writer, terminal: false);
        foreach (double s in new[] { 0.0, 0.5, 1.9, 2.0, 3.0, 4.1 })
        {
            progress.Report("sa", new TracePoint(s, (long)(s * 100), 100 - s, 101, true, "T=1"));
        }

        progress.Report("tabu", new TracePoint(0.1, 1, 99, 99, false, string.Empty));
        progress.Finish();

        var lines = writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(4, lines.Length); // sa at 0, 2.0 and 4.1; tabu at 0.1
        Assert.DoesNotContain('\r', writer.ToString());
        Assert.Contains("tabu: best 99.00 (infeasible)", lines[3], StringComparison.Ordinal);
    }

    [Fact]
    public void On_a_terminal_the_table_is_redrawn_in_place_with_one_row_per_solver()
    {
        var writer = new StringWriter();
        var progress = new ProgressReporter(writer, terminal: true, TimeSpan.FromSeconds(30));
        progress.Report("sa", new TracePoint(0.1, 1, 50, 50, true, string.Empty));
        progress.Report("tabu", new TracePoint(0.1, 1, 60, 60, false, string.Empty));
        progress.Finish();

        string text = writer.ToString();
        var table = progress.Table();
        Assert.Equal(3, table.Count); // header, sa, tabu
        Assert.Contains("left", table[0], StringComparison.Ordinal);
        Assert.Contains("50.00", table[1], StringComparison.Ordinal);
        Assert.Contains(" no ", table[2], StringComparison.Ordinal);
        Assert.Contains("\u001b[2F", text, StringComparison.Ordinal); // the second draw moves up over the two lines of the first
        Assert.EndsWith("\n", text, StringComparison.Ordinal);
    }
}
