using Anneal.Formats.Output.Artifacts;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Reports;

/// <summary>
/// The pictures and report.html of a run, drawn from the run.json and trace.csv written before them. An interrupted
/// run has none: drawing them took most of the writing (5 s of 8 s at 10,000 stops on a loaded machine), and a stop
/// should end the process within seconds; `anneal plot` draws them from the folder afterwards.
/// </summary>
public sealed class PicturesArtifact : IRunArtifact
{
    public void Write(RunContext run)
    {
        if (run.Outcome?.Interrupted == true)
        {
            return;
        }

        RunReport.Write(run.Folder, run.Instance, run.Plan, run.Replan is { } day && run.Changes is { } changes ? (day, changes) : null);
    }
}

public static class ReportServices
{
    /// <summary>Adds the pictures and report.html to every run; register after <c>AddAnneal</c>, whose files they read.</summary>
    public static IServiceCollection AddPictures(this IServiceCollection services) =>
        services.AddSingleton<IRunArtifact, PicturesArtifact>();
}
