using Anneal.Core.Model;

namespace Anneal.Core.Solving;

/// <summary>
/// For a solver that runs on any instance but not equally well on all: whether it is worth running when the user
/// names no solver, and what to say before it runs (its expected memory on a large job, say).
/// </summary>
public interface ISolverAdvice
{
    /// <summary>Why the solver is left out of the default set on this instance, in words; null when it runs by default.</summary>
    string? LeftOutOfDefaults(Instance instance);

    /// <summary>What a user should know before it runs on this instance; null when nothing.</summary>
    string? BeforeRun(Instance instance);
}
