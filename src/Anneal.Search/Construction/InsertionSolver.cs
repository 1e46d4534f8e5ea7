using System.Diagnostics;
using Anneal.Core.Model;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;
using Anneal.Core.Solving;

namespace Anneal.Search.Construction;

/// <summary>The construction heuristic on its own: a quick plan, and the seed of the metaheuristics.</summary>
public sealed class InsertionSolver : ISolver
{
    public string Name => "insertion";

    public string? Declines(Instance instance) => null;

    public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var clock = Stopwatch.StartNew();
        var state = Build(instance, new CandidateLists(instance, 30), cancel);
        double seconds = clock.Elapsed.TotalSeconds;
        var point = new TracePoint(seconds, 0, state.Objective, state.Objective, state.Feasible, "construction");
        progress?.Report(point);
        return new SolverResult(Name, state.ToPlan(), seconds, seconds, [point], cancel.IsCancellationRequested ? SolverStatus.Interrupted : SolverStatus.Completed);
    }

    /// <summary>A fresh state filled by cheapest insertion under high penalty weights.</summary>
    public static SearchState Build(Instance instance, CandidateLists candidates, CancellationToken cancel = default)
    {
        var state = new SearchState(instance, InitialWeights.ForConstruction(instance));
        CheapestInsertion.Run(state, candidates, CheapestInsertion.FarthestFirst(instance), cancel);
        return state;
    }
}
