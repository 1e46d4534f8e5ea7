using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Screening;
using Anneal.Formats.Output.Runs;
using Anneal.Reports.Traces;

namespace Anneal.Reports.Html;

/// <summary>Everything report.html shows; all of it comes from the run folder and the re-read input, so `anneal plot` can rebuild it.</summary>
public sealed record ReportInput(Instance Instance, PlanEvaluation Plan, RunRecord Run, IReadOnlyList<SolverRun> Solvers, ReportPictures Pictures)
{
    /// <summary>The solver whose plan was written, if the run searched.</summary>
    public SolverRun? Chosen
    {
        get
        {
            foreach (var s in Solvers)
            {
                if (s.Solver == Run.Chosen)
                {
                    return s;
                }
            }

            return null;
        }
    }

    /// <summary>The residual day of a re-plan and what changed against the given plan; null otherwise (and for `anneal plot`).</summary>
    public (Core.Replanning.ResidualDay Day, Core.Replanning.DayChanges Changes)? Replan { get; init; }

    private IReadOnlyList<Obstacle>? _obstacles;

    /// <summary>What the input screening finds no plan can do (computed once from the instance).</summary>
    public IReadOnlyList<Obstacle> Obstacles => _obstacles ??= JobScreen.Screen(Instance);
}
