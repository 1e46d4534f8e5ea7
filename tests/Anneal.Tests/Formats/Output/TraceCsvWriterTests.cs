using Anneal.Core.Solving;
using Anneal.Formats.Output;

namespace Anneal.Tests.Formats.Output;

public sealed class TraceCsvWriterTests
{
    [Fact]
    public void One_row_per_trace_point_with_the_header_first()
    {
        var writer = new StringWriter();
        TraceCsvWriter.Write(writer,
        [
            ("sa", new TracePoint(0.5, 100, 120.5, 130, false, "T=10")),
            ("sa", new TracePoint(1.0, 200, 110.25, 111, true, "T=5")),
            ("tabu", new TracePoint(0.7, 50, 115, 115, true, "tenure=7, a \"quoted\" note")),
        ]);

        var lines = writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(4, lines.Length);
        Assert.Equal("solver,seconds,iteration,best_objective,current_objective,best_feasible,state", lines[0].TrimEnd('\r'));
        Assert.Equal("sa,1.000,200,110.25,111,true,T=5", lines[2].TrimEnd('\r'));

        // RFC 4180 quoting for a field holding a comma and quotes.
        Assert.Equal("tabu,0.700,50,115,115,true,\"tenure=7, a \"\"quoted\"\" note\"", lines[3].TrimEnd('\r'));
    }
}
