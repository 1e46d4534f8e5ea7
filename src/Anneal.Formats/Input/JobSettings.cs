using Anneal.Core.Model;

namespace Anneal.Formats.Input;

/// <summary>Run settings that come with an input (settings.json of a CSV job); command-line values override them.</summary>
public sealed record JobSettings
{
    public Objective? Objective { get; init; }
    public double? TimeSeconds { get; init; }
    public IReadOnlyList<string>? Solvers { get; init; }
    public int? Seed { get; init; }

    /// <summary>settings.json's "replan": re-plan (or warm-start from) a plan file that came with the job; null otherwise.</summary>
    public JobReplan? Replan { get; init; }
}

/// <summary>
/// A re-plan asked for by the job itself, as `solve --from --now --without` asks it on the command line, so the worker
/// and the queue can take one: <paramref name="From"/> is the plan file's path (inside the job folder), <paramref
/// name="Now"/> the clock time in minutes of the job's day (null: a warm start), <paramref name="Without"/> the vehicle
/// ids taken out.
/// </summary>
public sealed record JobReplan(string From, double? Now, IReadOnlyList<string> Without);
