using Anneal.Formats.Output.Runs;

namespace Anneal.Formats.Output.Artifacts;

/// <summary>routes.csv.</summary>
public sealed class RoutesCsvArtifact : IRunArtifact
{
    public void Write(RunContext run) => RoutesCsvWriter.Write(run.PathOf(RoutesCsvWriter.FileName), run.Instance, run.Plan, run.Replan);
}

/// <summary>changes.csv, in a re-plan only.</summary>
public sealed class ChangesCsvArtifact : IRunArtifact
{
    public void Write(RunContext run)
    {
        if (run is { Replan: { } day, Changes: { } changes })
        {
            ChangesCsvWriter.Write(run.PathOf(ChangesCsvWriter.FileName), day.Day, changes);
        }
    }
}

/// <summary>routes.geojson, for jobs whose places are in degrees (latitude and longitude) only.</summary>
public sealed class RoutesGeoJsonArtifact : IRunArtifact
{
    public void Write(RunContext run)
    {
        if (run.Instance.LatLon)
        {
            RoutesGeoJsonWriter.Write(run.PathOf(RoutesGeoJsonWriter.FileName), run.Instance, run.Plan);
        }
    }
}

/// <summary>summary.json.</summary>
public sealed class SummaryJsonArtifact : IRunArtifact
{
    public void Write(RunContext run) => SummaryJsonWriter.Write(run.PathOf(SummaryJsonWriter.FileName), run.Summary);
}

/// <summary>trace.csv, after a search (not for `evaluate`).</summary>
public sealed class TraceCsvArtifact : IRunArtifact
{
    public void Write(RunContext run)
    {
        if (run.Outcome is { } outcome)
        {
            TraceCsvWriter.Write(run.PathOf(TraceCsvWriter.FileName), TraceCsvWriter.Rows(outcome));
        }
    }
}

/// <summary>run.json: what `anneal plot` needs to redraw the run.</summary>
public sealed class RunRecordArtifact : IRunArtifact
{
    public void Write(RunContext run) => RunRecordFile.Write(run.PathOf(RunRecordFile.FileName), RunRecordFile.Record(run));
}
