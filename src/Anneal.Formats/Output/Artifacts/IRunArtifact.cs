namespace Anneal.Formats.Output.Artifacts;

/// <summary>
/// One file (or set of files) a finished run leaves in its folder. The host lists the writers it wants, in order;
/// a later one may read what an earlier one wrote (the pictures read run.json and trace.csv).
/// </summary>
public interface IRunArtifact
{
    void Write(RunContext run);
}
