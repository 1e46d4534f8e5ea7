
namespace Anneal.Formats.Output.Runs;

/// <summary>
/// run.json: what a run folder must hold so that `anneal plot` can redraw every picture and the report without
/// solving again. The instance itself is not copied: it is read again from <see cref="InputPath"/>.
/// </summary>
/// <param name="InputPath">Absolute path of the job folder or benchmark file.</param>
/// <param name="Objective">The objective the plan was judged under (the command line may differ from the job's).</param>
/// <param name="Routes">The written plan, by vehicle and stop ids, in the evaluator's order.</param>
/// <param name="Solvers">Each solver's judged result; empty for `evaluate`.</param>
public sealed record RunRecord(
    int Version,
    string InputPath,
    string Format,
    string Objective,
    IReadOnlyList<RouteRecord> Routes,
    IReadOnlyList<SolverSummary> Solvers,
    string? Chosen,
    int? Seed,
    double? TimeLimitSeconds,
    bool Interrupted,
    DateTimeOffset GeneratedAt)
{
    public const int CurrentVersion = 1;

    /// <summary>The version of Anneal that wrote the file (older files: the reading version's).</summary>
    public string AnnealVersion { get; init; } = ToolVersion.Version;

    /// <summary>The commit that version was built from.</summary>
    public string Commit { get; init; } = ToolVersion.Commit;
}
