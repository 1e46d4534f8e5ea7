namespace Anneal.Core.Solving;

/// <summary>How long and how a solver may run. The first limit reached stops it.</summary>
public sealed record SolveOptions
{
    public TimeSpan TimeLimit { get; init; } = TimeSpan.FromSeconds(10);

    /// <summary>Stop after this many iterations; with a fixed seed this makes a run reproducible.</summary>
    public long? IterationLimit { get; init; }

    public int Seed { get; init; } = 1;

    /// <summary>Stop as soon as a feasible plan at or below this objective is found.</summary>
    public double? TargetObjective { get; init; }

    /// <summary>Independent seeded searches run in parallel by one solver; the best is kept.</summary>
    public int Threads { get; init; } = 1;

    /// <summary>
    /// A plan to start from instead of a construction (a warm start, or the repaired plan of a re-plan); null to
    /// construct one. Solvers that start from a plan take it as it is: the local searches load it, OR-Tools reads it
    /// as its initial assignment and CP-SAT as its hint.
    /// </summary>
    public Plans.Plan? StartPlan { get; init; }

    /// <summary>
    /// Where a solver offers its best plan as it goes (null: nobody asks). The run reports it should the solver not
    /// return in time; the copies of one solver's --threads share it.
    /// </summary>
    public Incumbent? Incumbent { get; init; }
}
