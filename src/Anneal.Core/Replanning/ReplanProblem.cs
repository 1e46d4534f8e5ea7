namespace Anneal.Core.Replanning;

/// <summary>Why a given plan cannot be re-planned as asked: the plan file's row (0 for the command line), the column or option, the value, what is wrong and the fix.</summary>
public sealed record ReplanProblem(int Row, string Column, string? Value, string Problem, string Fix);

/// <summary>The given plan contradicts itself or the job (a stop served before now that the job no longer has).</summary>
public sealed class ReplanException(IReadOnlyList<ReplanProblem> problems)
    : Exception(problems.Count > 0 ? problems[0].Problem : "the plan cannot be re-planned")
{
    public IReadOnlyList<ReplanProblem> Problems { get; } = problems;
}
