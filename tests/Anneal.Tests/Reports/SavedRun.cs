using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Formats.Input;

namespace Anneal.Tests.Reports;

/// <summary>Solves the small demo job quickly into a folder, as `anneal solve` would, so its run files are real.</summary>
internal static class SavedRun
{
    public static string Solve(string dir, TextWriter? output = null)
    {
        string folder = Path.Combine(dir, "run");
        var request = new SolveRequest { Solvers = "insertion,sa", TimeSeconds = 5, Iterations = 3000, OutDir = folder, Quiet = true, Seed = 3 };
        var context = new CliContext(output ?? TextWriter.Null, output ?? TextWriter.Null) { WorkingDirectory = dir };
        int code = SolveCommand.Execute(InputLoader.Load(ReportFixtures.HarbourSmall), request, context);
        Assert.True(code is ExitCodes.Success or ExitCodes.Infeasible, "solve exit code " + code);
        return folder;
    }
}
