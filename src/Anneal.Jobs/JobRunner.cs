using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Search.Running;

namespace Anneal.Jobs;

/// <summary>
/// The one run pipeline of every host (`solve`, the worker, `bench`): a job and a request in, the solvers run side by
/// side, every plan judged by the evaluator, the outcome out. Settings resolve the same way everywhere: the request,
/// then the job's settings.json, then the defaults.
/// </summary>
public sealed class JobRunner(SolverCatalog catalog)
{
    public SolverCatalog Catalog => catalog;

    /// <exception cref="UnknownSolverException">when the request or the job names a solver the catalogue lacks.</exception>
    public JobPlan Prepare(LoadedInput input, JobRequest request)
    {
        var objective = request.Objective ?? input.Settings.Objective ?? input.Instance.Objective;
        var instance = objective == input.Instance.Objective ? input.Instance : input.Instance.With(objective: objective);
        Core.Replanning.ResidualDay? replan = null;
        Core.Plans.Plan? start = null;
        if ((request.Replan ?? Asked(input)) is { } asked)
        {
            (replan, start) = Replanning.Replanner.Prepare(instance, asked);
            instance = replan.Instance;
        }

        var names = catalog.Resolve(request.Solvers, input.Settings.Solvers, instance);
        var solvers = new List<ISolver>(names.Count);
        foreach (var name in names)
        {
            solvers.Add(catalog.Create(name));
        }

        double seconds = request.TimeSeconds ?? input.Settings.TimeSeconds ?? request.DefaultTimeSeconds;
        var notes = new List<string>();
        if (request.Solvers is null && input.Settings.Solvers is null)
        {
            notes.AddRange(catalog.LeftOut(instance));
        }

        foreach (var solver in solvers)
        {
            if (solver is ISolverAdvice advice && advice.BeforeRun(instance) is { } text)
            {
                notes.Add($"{solver.Name}: {text}");
            }
        }

        var share = request.WholeRun ? WallClockBudget.SolverShare(seconds, request.Spent, instance, solvers) : TimeSpan.FromSeconds(seconds);
        if (request.WholeRun && WallClockBudget.Note(seconds, share, instance) is { } kept)
        {
            notes.Add(kept);
        }

        var options = new SolveOptions
        {
            TimeLimit = share,
            IterationLimit = request.Iterations,
            TargetObjective = request.Target,
            Seed = request.Seed ?? input.Settings.Seed ?? 1,
            Threads = request.Threads,
            StartPlan = start,
        };
        return new JobPlan(input, instance, solvers, options, seconds, notes) { Replan = replan };
    }

    /// <summary>
    /// The re-plan the job asks for itself (settings.json's "replan", its plan file beside the job's files), so that the
    /// worker and the queue re-plan as `solve --from` does; the command line's --from wins.
    /// </summary>
    private static Replanning.ReplanInput? Asked(LoadedInput input)
    {
        if (input.Settings.Replan is not { } replan)
        {
            return null;
        }

        string folder = Directory.Exists(input.Path) ? input.Path : Path.GetDirectoryName(Path.GetFullPath(input.Path)) ?? ".";
        return new Replanning.ReplanInput(Path.Combine(folder, replan.From), replan.Now, replan.Without);
    }

    /// <param name="progress">Receives (solver name, trace point) from every solver as it improves, on the solvers' threads.</param>
    public JobRun Run(JobPlan plan, Action<string, TracePoint>? progress, CancellationToken cancel)
    {
        Func<Anneal.Core.Model.Instance, SolverResult, JudgedResult> judge = plan.Options.StartPlan is { } start
            ? new Replanning.WarmStartJudge(plan.Instance, start).Judge
            : ResultJudge.Judge;
        return new(plan, RunCoordinator.Run(plan.Instance, plan.Solvers, plan.Options, progress, cancel, judge) with { Notes = plan.Notes });
    }

    public JobRun Run(LoadedInput input, JobRequest request, Action<string, TracePoint>? progress, CancellationToken cancel) =>
        Run(Prepare(input, request), progress, cancel);
}
